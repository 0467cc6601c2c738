import { describe, expect, it } from 'vitest';
import { SingularCovarianceError } from '../errors/engine-errors';
import { cholesky, choleskyOrNull, squaredDistance, whiten } from './cholesky';
import { multiply, transpose } from './matrix';

const context = (variables: string[]) => ({ group: 'Quarry A', variables });

describe('cholesky', () => {
  it('reproduces S = L·Lᵀ and log|S|', () => {
    const s = [
      [4, 2, 0.6],
      [2, 5, 1.5],
      [0.6, 1.5, 3],
    ];
    const { lower, logDet } = cholesky(s, context(['a', 'b', 'c']));
    const product = multiply(lower, transpose(lower));
    product.forEach((row, i) => row.forEach((value, j) => expect(value).toBeCloseTo(s[i][j], 14)));
    // |S| by cofactor expansion, independent of the factorisation.
    const det = 4 * (5 * 3 - 1.5 * 1.5) - 2 * (2 * 3 - 1.5 * 0.6) + 0.6 * (2 * 1.5 - 5 * 0.6);
    expect(logDet).toBeCloseTo(Math.log(det), 13);
  });

  it('gives D² equal to the quadratic form with the cofactor inverse of a 2×2 matrix', () => {
    const s = [
      [2, 0.5],
      [0.5, 1],
    ];
    const det = 2 * 1 - 0.25;
    const r = [1.5, -0.7];
    const expected = (1 * r[0] * r[0] - 2 * 0.5 * r[0] * r[1] + 2 * r[1] * r[1]) / det;
    const { lower } = cholesky(s, context(['a', 'b']));
    expect(squaredDistance(lower, r, [0, 0])).toBeCloseTo(expected, 14);
    const z = whiten(lower, r, [0, 0], [0, 0]);
    expect(z[0] ** 2 + z[1] ** 2).toBeCloseTo(expected, 14);
  });

  it('names a constant variable', () => {
    const s = [
      [1, 0],
      [0, 0],
    ];
    expect(() => cholesky(s, context(['Cu', 'Zn']))).toThrow(/"Zn".*constant/);
  });

  it('names a collinear variable and the ones it depends on', () => {
    // c = a + 2b exactly; d is independent noise.
    const rows = [
      [1, 2, 5, 0.3],
      [2, 1, 4, -0.1],
      [0, 3, 6, 0.4],
      [3, 3, 9, -0.5],
      [1, 0, 1, 0.2],
    ];
    const s = covarianceOf(rows);
    try {
      cholesky(s, context(['a', 'b', 'c', 'd']));
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(SingularCovarianceError);
      expect((error as SingularCovarianceError).variables).toEqual(['a', 'b', 'c']);
      expect((error as Error).message).toMatch(/Quarry A.*"c" is a linear combination of "a", "b"/);
    }
  });

  it('recognises a closed composition and suggests a log-ratio transform', () => {
    const rows = [
      [0.2, 0.3, 0.5],
      [0.1, 0.6, 0.3],
      [0.4, 0.4, 0.2],
      [0.3, 0.1, 0.6],
    ];
    expect(() => cholesky(covarianceOf(rows), context(['Si', 'Al', 'Fe']))).toThrow(/closed composition.*log-ratio/);
  });

  it('choleskyOrNull returns null instead of throwing', () => {
    expect(
      choleskyOrNull([
        [1, 1],
        [1, 1],
      ]),
    ).toBeNull();
  });
});

function covarianceOf(rows: number[][]): number[][] {
  const n = rows.length;
  const p = rows[0].length;
  const mean = Array.from({ length: p }, (_, j) => rows.reduce((s, r) => s + r[j], 0) / n);
  return Array.from({ length: p }, (_, j) =>
    Array.from({ length: p }, (_, k) => rows.reduce((s, r) => s + (r[j] - mean[j]) * (r[k] - mean[k]), 0) / (n - 1)),
  );
}
