import { describe, expect, it } from 'vitest';
import { chiSquareFalseRejectionRate } from '../distributions/false-rejection-rate';
import { chiSquareQuantile } from '../distributions/quantiles';
import { betaUpperTail } from '../distributions/upper-tails';
import { GroupTooSmallError, InvalidInputError } from '../errors/engine-errors';
import { squaredDistance } from '../linalg/cholesky';
import { mulberry32 } from '../random/mulberry32';
import { fitGroup } from '../stats/group-model';
import {
  leaveOneOutDistance,
  newObservationF,
  pChiSquare,
  pHotelling,
  pHotellingLeaveOneOut,
  pMemberBeta,
} from './membership';

const variables = ['a', 'b', 'c', 'd'];

function normalRows(n: number, p: number, seed: number): number[][] {
  const random = mulberry32(seed);
  return Array.from({ length: n }, () => {
    const shared = random.normal();
    return Array.from({ length: p }, (_, j) => (j + 1) * random.normal() + shared);
  });
}

describe('membership probabilities', () => {
  it('new-observation F scaling and probability (NIST e-Handbook §6.5.4.3)', () => {
    // n = 20, p = 3: F = 20·17/(3·21·19) · D².
    expect(newObservationF(5, 20, 3)).toBeCloseTo(((20 * 17) / (3 * 21 * 19)) * 5, 14);
    expect(pHotelling(0, 20, 3)).toBe(1);
    expect(pChiSquare(9.488, 4)).toBeCloseTo(0.05, 4); // χ²₄(0.95) = 9.488 (e-Handbook §1.3.6.7.4)
  });

  it('refuse groups at or below the minimum size, naming group, n and p', () => {
    expect(() => pHotelling(1, 4, 4, 'Kiln 3')).toThrow(GroupTooSmallError);
    expect(() => pHotelling(1, 4, 4, 'Kiln 3')).toThrow(/"Kiln 3" has n = 4 members on p = 4/);
    expect(() => pMemberBeta(1, 5, 4, 'Kiln 3')).toThrow(GroupTooSmallError);
  });

  it('a member D² never exceeds (n−1)²/n, so with n = 10, p = 4 the chi-square rule cannot flag a member', () => {
    const rows = normalRows(10, 4, 3);
    const model = fitGroup('g', rows, variables);
    const d2 = rows.map((row) => squaredDistance(model.cholesky.lower, row, model.mean));
    expect(Math.max(...d2)).toBeLessThanOrEqual(8.1 + 1e-12);
    // Sum of member D² is exactly (n − 1)·p (trace identity of the unbiased covariance).
    expect(d2.reduce((s, v) => s + v, 0)).toBeCloseTo(9 * 4, 10);
    expect(chiSquareQuantile(0.95, 4)).toBeGreaterThan(8.1);
    expect(() => pMemberBeta(8.2, 10, 4)).toThrow(InvalidInputError);
  });
});

describe('leave-one-out without refitting', () => {
  const rows = normalRows(15, 4, 21);
  const model = fitGroup('g', rows, variables);
  const n = rows.length;

  it('matches brute-force refits without each member to 1e-10', () => {
    rows.forEach((row, i) => {
      const full = squaredDistance(model.cholesky.lower, row, model.mean);
      const refit = fitGroup(
        'g',
        rows.filter((_, k) => k !== i),
        variables,
      );
      const brute = squaredDistance(refit.cholesky.lower, row, refit.mean);
      expect(Math.abs(leaveOneOutDistance(full, n, 4) - brute) / brute).toBeLessThan(1e-10);
      const bruteP = pHotelling(brute, n - 1, 4);
      expect(Math.abs(pHotellingLeaveOneOut(full, n, 4) - bruteP) / bruteP).toBeLessThan(1e-9);
    });
  });

  it('its F probability equals the Beta upper tail of n·D²/(n−1)² (METHODS.md §1)', () => {
    for (const row of rows) {
      const d2 = squaredDistance(model.cholesky.lower, row, model.mean);
      const beta = betaUpperTail((n * d2) / ((n - 1) * (n - 1)), 2, (n - 4 - 1) / 2);
      expect(Math.abs(pHotellingLeaveOneOut(d2, n, 4) - beta)).toBeLessThan(1e-13);
      expect(Math.abs(pMemberBeta(d2, n, 4) - beta)).toBeLessThan(1e-13);
    }
  });
});

describe('calibration by seeded simulation (n = 12, p = 4, α = 0.05)', () => {
  // Each trial draws 12 members and one new member from the same normal law (affine invariance lets
  // the identity covariance stand for any). 20 000 trials: the binomial standard error is
  // √(0.05·0.95/20000) = 0.0015 at 5 % and √(0.27·0.73/20000) = 0.0031 at 27 %; tolerances are
  // four standard errors.
  const trials = 20_000;
  const random = mulberry32(2024);
  const chiCut = chiSquareQuantile(0.95, 4);
  let hotellingRejects = 0;
  let chiRejects = 0;
  for (let t = 0; t < trials; t++) {
    const members = Array.from({ length: 12 }, () => variables.map(() => random.normal()));
    const model = fitGroup('g', members, variables);
    const d2 = squaredDistance(
      model.cholesky.lower,
      variables.map(() => random.normal()),
      model.mean,
    );
    if (pHotelling(d2, 12, 4) < 0.05) hotellingRejects++;
    if (d2 > chiCut) chiRejects++;
  }

  it('the Hotelling (F) rule rejects about 5 % of true new members', () => {
    expect(Math.abs(hotellingRejects / trials - 0.05)).toBeLessThan(4 * 0.0015);
  });

  it('the chi-square rule rejects the exact rate of chiSquareFalseRejectionRate (about 27 %)', () => {
    const exact = chiSquareFalseRejectionRate(12, 4, 0.05);
    expect(Math.abs(chiRejects / trials - exact)).toBeLessThan(4 * 0.0031);
  });
});
