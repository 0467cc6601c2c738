import { quantile } from './figures';

describe('quantile (nearest rank, Hyndman & Fan 1996 definition 1)', () => {
  it('takes the value at rank ceil(q·n) of the sorted sample', () => {
    const hundred = Array.from({ length: 100 }, (_, i) => 100 - i);
    expect(quantile(hundred, 0.95)).toBe(95);
    expect(quantile(hundred, 0.5)).toBe(50);
    // The nearest-rank worked example in Wikipedia's "Percentile" article: 15, 20, 35, 40, 50.
    expect(quantile([50, 15, 40, 20, 35], 0.05)).toBe(15);
    expect(quantile([50, 15, 40, 20, 35], 0.3)).toBe(20);
    expect(quantile([50, 15, 40, 20, 35], 0.4)).toBe(20);
    expect(quantile([50, 15, 40, 20, 35], 0.5)).toBe(35);
    expect(quantile([50, 15, 40, 20, 35], 1)).toBe(50);
    expect(quantile([7], 0.95)).toBe(7);
  });

  it('refuses an empty sample instead of returning undefined', () => {
    expect(() => quantile([], 0.5)).toThrow('a quantile of no values is undefined');
  });
});
