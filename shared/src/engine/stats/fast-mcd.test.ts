import { describe, expect, it } from 'vitest';
import { loadHbk } from '../__fixtures__/load-fixtures.mjs';
import { chiSquareQuantile } from '../distributions/quantiles';
import { SingularCovarianceError } from '../errors/engine-errors';
import { squaredDistance } from '../linalg/cholesky';
import { mulberry32 } from '../random/mulberry32';
import { fastMcd } from './fast-mcd';
import { columnMeans, covariance } from './moments';
import { cholesky } from '../linalg/cholesky';

const context = { group: 'hbk', variables: ['X1', 'X2', 'X3'] };

describe('fastMcd on the Hawkins–Bradu–Kass data', () => {
  // Source: Hawkins, Bradu & Kass (1984), Technometrics 26:197; rows 1–14 are the planted outliers in
  // X1–X3, and a robust (MCD) fit flags exactly those at χ²₃(0.975) (Rousseeuw & Van Driessen 1999).
  const { x, rowNames } = loadHbk();
  const cutoff = chiSquareQuantile(0.975, 3);
  const expected = Array.from({ length: 14 }, (_, i) => i + 1);

  it('flags exactly rows 1–14', () => {
    const result = fastMcd(x, { seed: 1, context });
    const flagged = rowNames.filter((_, i) => result.distances[i] > cutoff);
    expect(flagged).toEqual(expected);
    // The reweighting step leaves every planted outlier out of the support.
    expect(expected.every((row) => !result.support[row - 1])).toBe(true);
  });

  it('flags the same rows whatever the seed, and records the seed', () => {
    for (const seed of [2, 99, 123456]) {
      const result = fastMcd(x, { seed, context });
      expect(result.seed).toBe(seed);
      expect(rowNames.filter((_, i) => result.distances[i] > cutoff)).toEqual(expected);
    }
  });

  it('repeats exactly with the same seed', () => {
    expect(fastMcd(x, { seed: 5, context }).distances).toEqual(fastMcd(x, { seed: 5, context }).distances);
  });

  it('the classical covariance is masked: it flags only a few of the 14', () => {
    const mean = columnMeans(x);
    const factor = cholesky(covariance(x, mean), context);
    const flagged = rowNames.filter((_, i) => squaredDistance(factor.lower, x[i], mean) > cutoff);
    expect(flagged.length).toBeLessThan(5);
  });
});

describe('fastMcd on clean normal data', () => {
  it('is close to the classical estimate (consistency and reweighting factors at work)', () => {
    // Seeded simulation: 2000 draws of N(0, diag(1, 4, 9)); robust and classical variances agree
    // within sampling error (the variance of a variance estimate is about 2σ⁴/n, about 3 % here).
    const random = mulberry32(7);
    const rows = Array.from({ length: 2000 }, () => [random.normal(), 2 * random.normal(), 3 * random.normal()]);
    const result = fastMcd(rows, { seed: 3, context });
    expect(result.covariance[0][0]).toBeGreaterThan(0.9);
    expect(result.covariance[0][0]).toBeLessThan(1.1);
    expect(result.covariance[2][2] / 9).toBeGreaterThan(0.9);
    expect(result.covariance[2][2] / 9).toBeLessThan(1.1);
    expect(result.h).toBe(Math.floor((2000 + 3 + 1) / 2));
  });

  it('refuses data where more than h members lie on a hyperplane', () => {
    const rows = Array.from({ length: 30 }, (_, i) => (i < 25 ? [i, 2 * i, 1] : [i, i * i, i]));
    expect(() => fastMcd(rows, { seed: 1, context })).toThrow(SingularCovarianceError);
  });
});
