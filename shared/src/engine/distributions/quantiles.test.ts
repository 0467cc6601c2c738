import { describe, expect, it } from 'vitest';
import { betaQuantile, chiSquareQuantile, fQuantile } from './quantiles';
import { betaUpperTail } from './upper-tails';

// Source: NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.4 (upper critical values of the
// chi-square distribution), as listed in METHODS.md §7 (three decimals).
const chiSquareTable: [number, number, number][] = [
  [2, 5.991, 9.21],
  [3, 7.815, 11.345],
  [4, 9.488, 13.277],
  [5, 11.07, 15.086],
  [6, 12.592, 16.812],
  [7, 14.067, 18.475],
  [8, 15.507, 20.09],
  [9, 16.919, 21.666],
  [10, 18.307, 23.209],
];

describe('chiSquareQuantile', () => {
  it.each(chiSquareTable)('df %i matches the e-Handbook 0.95 and 0.99 critical values', (df, q95, q99) => {
    expect(chiSquareQuantile(0.95, df)).toBeCloseTo(q95, 3);
    expect(chiSquareQuantile(0.99, df)).toBeCloseTo(q99, 3);
  });

  it('matches the e-Handbook 0.975 column (df 3, 4, 6)', () => {
    // Source: NIST/SEMATECH e-Handbook §1.3.6.7.4, via METHODS.md §7.
    expect(chiSquareQuantile(0.975, 3)).toBeCloseTo(9.348, 3);
    expect(chiSquareQuantile(0.975, 4)).toBeCloseTo(11.143, 3);
    expect(chiSquareQuantile(0.975, 6)).toBeCloseTo(14.449, 3);
  });
});

describe('fQuantile', () => {
  // Source: NIST/SEMATECH e-Handbook §1.3.6.7.2 (upper critical values of the F distribution),
  // as listed in METHODS.md §7.
  it.each([
    [0.95, 2, 10, 4.103],
    [0.95, 3, 10, 3.708],
    [0.95, 4, 20, 2.866],
    [0.95, 5, 20, 2.711],
    [0.99, 2, 10, 7.559],
    [0.99, 4, 20, 4.431],
  ])('P = %f, F(%i, %i) = %f', (probability, d1, d2, expected) => {
    expect(fQuantile(probability, d1, d2)).toBeCloseTo(expected, 3);
  });
});

describe('betaQuantile', () => {
  it('inverts the upper tail', () => {
    const x = betaQuantile(0.95, 2, 3.5);
    expect(betaUpperTail(x, 2, 3.5)).toBeCloseTo(0.05, 12);
  });
});
