import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../random/mulberry32';
import {
  betaUpperTailFor,
  betaUpperTailIntegerA,
  chiSquareUpperTailEvenDf,
  chiSquareUpperTailFor,
} from './fast-upper-tails';
import { betaUpperTail, chiSquareUpperTail } from './upper-tails';

const relative = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('finite series against the general incomplete gamma / beta functions', () => {
  it('chi-square, even df, agrees to 1e-12 relative across the body and the far tail', () => {
    const random = mulberry32(11);
    for (const k of [1, 2, 3, 5, 12, 15, 40]) {
      for (let trial = 0; trial < 200; trial++) {
        const x = Math.exp(random.next() * 14 - 7) * 2 * k; // from e^-7 to e^7 times the mean
        const general = chiSquareUpperTail(x, 2 * k);
        if (general > 1e-290) expect(relative(chiSquareUpperTailEvenDf(x, k), general)).toBeLessThan(1e-12);
      }
    }
  });

  it('beta with integer a matches the closed form for a = 2 to 1e-14: (1 − x)ᵇ (1 + b·x)', () => {
    for (const [x, b] of [
      [0.25, 40.5],
      [0.6, 3.5],
      [0.05, 488],
    ]) {
      const exact = Math.pow(1 - x, b) * (1 + b * x);
      expect(relative(betaUpperTailIntegerA(x, 1 - x, 2, b), exact)).toBeLessThan(1e-14);
    }
  });

  // The general incomplete beta itself strays by up to about 3e-12 relative for large b (it gives
  // 9.689049775668269e-5 for P[Beta(2, 40.5) > 0.25], whose closed form above is 9.68904977564593e-5),
  // so this comparison allows 1e-11.
  it('beta with integer a agrees with the general function to 1e-11 relative', () => {
    const random = mulberry32(12);
    for (const a of [1, 2, 4, 12, 15]) {
      for (const b of [0.5, 1, 2.5, 3.5, 8, 40.5, 488]) {
        for (let trial = 0; trial < 100; trial++) {
          const x = random.next();
          const general = betaUpperTail(x, a, b);
          if (general > 1e-290) expect(relative(betaUpperTailIntegerA(x, 1 - x, a, b), general)).toBeLessThan(1e-11);
        }
      }
    }
  });

  it('hands over to the general function where the leading factor would underflow', () => {
    expect(chiSquareUpperTailEvenDf(1600, 12)).toBe(chiSquareUpperTail(1600, 24));
    expect(betaUpperTailIntegerA(0.9999, 1e-4, 12, 200)).toBe(betaUpperTail(0.9999, 12, 200));
  });

  it('factories pick the general function when the shape is not an integer', () => {
    expect(chiSquareUpperTailFor(3)(4.2)).toBe(chiSquareUpperTail(4.2, 3));
    expect(betaUpperTailFor(1.5, 3)(0.2, 0.8)).toBe(betaUpperTail(0.2, 1.5, 3));
    expect(relative(chiSquareUpperTailFor(4)(4.2), chiSquareUpperTail(4.2, 4))).toBeLessThan(1e-14);
  });
});
