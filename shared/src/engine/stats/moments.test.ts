import { describe, expect, it } from 'vitest';
import { columnMeans, covariance } from './moments';
import { pooledCovariance } from './pooled-covariance';
import { InvalidInputError } from '../errors/engine-errors';

describe('columnMeans and covariance', () => {
  it('match a hand computation', () => {
    const rows = [
      [1, 2],
      [3, 6],
      [5, 7],
    ];
    expect(columnMeans(rows)).toEqual([3, 5]);
    // Deviations (−2, −3), (0, 1), (2, 2): Σ = (8, 10; 10, 14), divided by n − 1 = 2.
    expect(covariance(rows)).toEqual([
      [4, 5],
      [5, 7],
    ]);
  });

  it('keeps precision with a large common offset (two-pass method)', () => {
    const rows = [[1e9 + 1], [1e9 + 2], [1e9 + 3]];
    expect(covariance(rows)[0][0]).toBe(1);
  });

  it('refuses fewer than two rows', () => {
    expect(() => covariance([[1, 2]])).toThrow(InvalidInputError);
  });
});

describe('pooledCovariance', () => {
  it('weights each group by its degrees of freedom', () => {
    const a = [[1], [3]]; // variance 2, 1 df
    const b = [[0], [3], [6]]; // variance 9, 2 df
    expect(pooledCovariance([a, b])[0][0]).toBeCloseTo((1 * 2 + 2 * 9) / 3, 14);
  });
});
