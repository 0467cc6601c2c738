import { describe, expect, it } from 'vitest';
import { squaredDistance } from '../linalg/cholesky';
import { mulberry32 } from '../random/mulberry32';
import { fitGroup } from '../stats/group-model';
import { distanceContributions } from './contributions';

describe('distanceContributions', () => {
  it('are non-negative and sum to D²', () => {
    const random = mulberry32(8);
    const rows = Array.from({ length: 30 }, () => [random.normal(), random.normal() * 2, random.normal() + 1]);
    const model = fitGroup('g', rows, ['a', 'b', 'c']);
    const x = [2, -3, 4];
    const parts = distanceContributions(model, x);
    expect(parts.every((v) => v >= 0)).toBe(true);
    expect(parts.reduce((s, v) => s + v, 0)).toBeCloseTo(squaredDistance(model.cholesky.lower, x, model.mean), 12);
  });

  it('the first contribution is the standardised squared deviation of the first variable', () => {
    const rows = [
      [1, 5],
      [2, 3],
      [4, 4],
      [5, 9],
    ];
    const model = fitGroup('g', rows, ['a', 'b']);
    const [first] = distanceContributions(model, [6, 0]);
    expect(first).toBeCloseTo((6 - model.mean[0]) ** 2 / model.covariance[0][0], 13);
  });
});
