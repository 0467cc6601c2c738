import { describe, expect, it } from 'vitest';
import { mulberry32 } from './mulberry32';

describe('mulberry32', () => {
  it('repeats its stream for a seed and differs between seeds', () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const c = mulberry32(43);
    const first = Array.from({ length: 5 }, () => a.next());
    expect(Array.from({ length: 5 }, () => b.next())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c.next())).not.toEqual(first);
  });

  it('gives uniform numbers on [0, 1) with mean ½ and variance 1/12 within sampling error', () => {
    const random = mulberry32(1);
    const n = 100_000;
    const draws = Array.from({ length: n }, () => random.next());
    const mean = draws.reduce((s, x) => s + x, 0) / n;
    const variance = draws.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1);
    // Standard error of the mean is √(1/12/n) ≈ 0.0009; 5 standard errors.
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.0046);
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(0.002);
    expect(Math.min(...draws)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...draws)).toBeLessThan(1);
  });

  it('gives standard normal numbers (mean 0, variance 1, 95 % within ±1.96)', () => {
    const random = mulberry32(2);
    const n = 100_000;
    const draws = Array.from({ length: n }, () => random.normal());
    const mean = draws.reduce((s, x) => s + x, 0) / n;
    const variance = draws.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1);
    const inside = draws.filter((x) => Math.abs(x) < 1.959964).length / n;
    expect(Math.abs(mean)).toBeLessThan(0.016);
    expect(Math.abs(variance - 1)).toBeLessThan(0.023);
    // Binomial standard error √(0.95·0.05/n) ≈ 0.0007.
    expect(Math.abs(inside - 0.95)).toBeLessThan(0.0035);
  });

  it('draws integers below n', () => {
    const random = mulberry32(3);
    const draws = Array.from({ length: 1000 }, () => random.int(7));
    expect(new Set(draws)).toEqual(new Set([0, 1, 2, 3, 4, 5, 6]));
  });
});
