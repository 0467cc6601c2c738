import { jStat } from 'jstat';
import { describe, expect, it } from 'vitest';
import { InvalidInputError } from '../errors/engine-errors';
import { betaUpperTail, chiSquareUpperTail, fUpperTail } from './upper-tails';

// Reference: jstat 1.9.6 (an independent implementation of the same functions). jstat computes
// 1 − cdf and its continued fractions stop near 1e-8 relative (it gives 0.49999998 for the exact
// P[Beta(½, ½) > ½] = ½), so the grid allows 1e-7 and stays where 1 − cdf keeps enough digits.
const JSTAT_TOLERANCE = 1e-7;
const relative = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('chiSquareUpperTail', () => {
  it('matches jstat over a grid of df and x', () => {
    for (const df of [1, 2, 3, 4, 5, 7, 10, 24, 30]) {
      for (const x of [0.01, 0.5, 1, 2.5, 5, 9.488, 15, 30, 50]) {
        const reference = 1 - jStat.chisquare.cdf(x, df);
        if (reference > 1e-6) expect(relative(chiSquareUpperTail(x, df), reference)).toBeLessThan(JSTAT_TOLERANCE);
      }
    }
  });

  it('keeps precision far in the tail where 1 − cdf would round to 0', () => {
    // Exact: P[χ²_2 > x] = e^{−x/2}.
    expect(relative(chiSquareUpperTail(200, 2), Math.exp(-100))).toBeLessThan(1e-13);
    expect(1 - jStat.chisquare.cdf(200, 2)).toBe(0);
  });

  it('is 1 at 0 and 0 at infinity', () => {
    expect(chiSquareUpperTail(0, 4)).toBe(1);
    expect(chiSquareUpperTail(Infinity, 4)).toBe(0);
  });

  it('refuses NaN and bad degrees of freedom instead of returning NaN', () => {
    expect(() => chiSquareUpperTail(Number.NaN, 3)).toThrow(InvalidInputError);
    expect(() => chiSquareUpperTail(1, 0)).toThrow(InvalidInputError);
  });
});

describe('fUpperTail', () => {
  it('matches jstat over a grid of (d1, d2, f)', () => {
    for (const [d1, d2] of [
      [1, 5],
      [2, 10],
      [3, 10],
      [4, 8],
      [4, 95],
      [5, 20],
      [24, 7.5],
      [24, 200],
    ]) {
      for (const f of [0.05, 0.3, 1, 2, 3.7, 6, 12]) {
        const reference = 1 - jStat.centralF.cdf(f, d1, d2);
        if (reference > 1e-6) expect(relative(fUpperTail(f, d1, d2), reference)).toBeLessThan(JSTAT_TOLERANCE);
      }
    }
  });

  it('keeps precision in the far tail: F(2, d2) has P[F > f] = (1 + 2f/d2)^(−d2/2) exactly', () => {
    const f = 1e4;
    expect(relative(fUpperTail(f, 2, 10), Math.pow(1 + (2 * f) / 10, -5))).toBeLessThan(1e-12);
  });
});

describe('betaUpperTail', () => {
  it('matches jstat over a grid', () => {
    for (const [a, b] of [
      [0.5, 0.5],
      [1, 3],
      [2, 2],
      [2, 4.5],
      [12, 3.5],
      [15, 40],
    ]) {
      for (const x of [0.01, 0.1, 0.3, 0.5, 0.7, 0.9]) {
        const reference = 1 - jStat.beta.cdf(x, a, b);
        if (reference > 1e-6) expect(relative(betaUpperTail(x, a, b), reference)).toBeLessThan(JSTAT_TOLERANCE);
      }
    }
  });

  it('gives exact values where closed forms exist', () => {
    // Beta(½, ½) is the arcsine law: P[X > x] = 1 − (2/π)·asin(√x).
    expect(betaUpperTail(0.5, 0.5, 0.5)).toBeCloseTo(0.5, 14);
    expect(betaUpperTail(0.3, 0.5, 0.5)).toBeCloseTo(1 - (2 / Math.PI) * Math.asin(Math.sqrt(0.3)), 14);
  });

  it('refuses x outside [0, 1]', () => {
    expect(() => betaUpperTail(1.5, 2, 2)).toThrow(InvalidInputError);
  });
});
