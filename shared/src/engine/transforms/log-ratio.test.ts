import { describe, expect, it } from 'vitest';
import { NonPositiveValueError } from '../errors/engine-errors';
import { multiply, transpose } from '../linalg/matrix';
import {
  alrTransform,
  clrToPivotCoordinates,
  clrTransform,
  ilrTransform,
  lnTransform,
  log10Transform,
  pivotBasis,
} from './log-ratio';

const rows = [
  [0.2, 0.3, 0.1, 0.4],
  [0.05, 0.5, 0.25, 0.2],
];

describe('log transforms', () => {
  it('log10 and ln', () => {
    expect(log10Transform([[1000, 0.01]])).toEqual([[3, -2]]);
    expect(lnTransform([[Math.E]])[0][0]).toBeCloseTo(1, 15);
  });

  it('refuse zeros and negatives with row and column', () => {
    expect(() =>
      lnTransform([
        [1, 2],
        [3, 0],
      ]),
    ).toThrow(NonPositiveValueError);
    expect(() =>
      lnTransform([
        [1, 2],
        [3, 0],
      ]),
    ).toThrow(/row 2, column 2/);
  });
});

describe('alr and clr', () => {
  it('alr is ln(xᵢ/x_D) without the denominator column', () => {
    const out = alrTransform(rows, 3);
    expect(out[0]).toHaveLength(3);
    expect(out[0][0]).toBeCloseTo(Math.log(0.2 / 0.4), 15);
    expect(alrTransform(rows, 0)[1][2]).toBeCloseTo(Math.log(0.2 / 0.05), 15);
  });

  it('clr rows sum to zero and are scale invariant', () => {
    const out = clrTransform(rows);
    expect(out[0].reduce((s, v) => s + v, 0)).toBeCloseTo(0, 14);
    const scaled = clrTransform(rows.map((r) => r.map((v) => v * 1e6)));
    scaled.forEach((r, i) => r.forEach((v, j) => expect(v).toBeCloseTo(out[i][j], 12)));
  });
});

describe('ilr pivot coordinates', () => {
  it('the pivot basis is orthonormal with columns summing to zero (Vᵀ·V = I, 1ᵀ·V = 0)', () => {
    const v = pivotBasis(5);
    const gram = multiply(transpose(v), v);
    gram.forEach((row, i) => row.forEach((value, j) => expect(value).toBeCloseTo(i === j ? 1 : 0, 14)));
    transpose(v).forEach((column) => expect(column.reduce((s, x) => s + x, 0)).toBeCloseTo(0, 14));
  });

  it('matches the pivot formula of Filzmoser & Hron (2008) and clr · V', () => {
    const direct = ilrTransform(rows);
    // z₁ = √(3/4) · ln(x₁ / (x₂x₃x₄)^(1/3)), written out from the formula.
    const [a, b, c, d] = rows[0];
    expect(direct[0][0]).toBeCloseTo(Math.sqrt(3 / 4) * Math.log(a / Math.cbrt(b * c * d)), 14);
    expect(direct[0][2]).toBeCloseTo(Math.sqrt(1 / 2) * Math.log(c / d), 14);
    const viaClr = clrToPivotCoordinates(clrTransform(rows));
    viaClr.forEach((r, i) => r.forEach((value, j) => expect(value).toBeCloseTo(direct[i][j], 14)));
  });

  it('is an isometry: Euclidean distances equal the clr (Aitchison) distances', () => {
    const [za, zb] = ilrTransform(rows);
    const [ca, cb] = clrTransform(rows);
    const dist = (x: number[], y: number[]) => Math.hypot(...x.map((v, i) => v - y[i]));
    expect(dist(za, zb)).toBeCloseTo(dist(ca, cb), 14);
  });
});
