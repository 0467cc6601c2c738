import { describe, expect, it } from 'vitest';
import { GroupTooSmallError } from '../errors/engine-errors';
import { confidenceEllipse, projectGroup } from './confidence-ellipse';

const group = projectGroup(
  [1, 2, 3],
  [
    [4, 1, 0.5],
    [1, 2, 0.3],
    [0.5, 0.3, 1],
  ],
  [
    [1, 0, 0],
    [0, 0.6, 0.8],
  ],
);

describe('projectGroup', () => {
  it('projects the mean and covariance', () => {
    expect(group.mean).toEqual([1, 0.6 * 2 + 0.8 * 3]);
    expect(group.covariance[0][0]).toBe(4);
    expect(group.covariance[0][1]).toBeCloseTo(0.6 + 0.4, 14);
    expect(group.covariance[1][1]).toBeCloseTo(0.36 * 2 + 2 * 0.48 * 0.3 + 0.64, 14);
  });
});

describe('confidenceEllipse', () => {
  it('q is χ²₂(level): 4.605 at 90 %, 5.991 at 95 % (METHODS.md §6, e-Handbook §1.3.6.7.4)', () => {
    expect(confidenceEllipse(group, { level: 0.9, basis: 'chi2' }).q).toBeCloseTo(4.605, 3);
    expect(confidenceEllipse(group, { level: 0.95, basis: 'chi2' }).q).toBeCloseTo(5.991, 3);
  });

  it('every outline point lies at D² = q from the centre', () => {
    const { x, y, q } = confidenceEllipse(group, { level: 0.95, basis: 'chi2', points: 64 });
    const [[a, b], [, d]] = group.covariance;
    const det = a * d - b * b;
    x.forEach((xi, i) => {
      const u = xi - group.mean[0];
      const v = y[i] - group.mean[1];
      expect((d * u * u - 2 * b * u * v + a * v * v) / det).toBeCloseTo(q, 10);
    });
    expect(x).toHaveLength(65);
    expect(x[64]).toBeCloseTo(x[0], 14);
  });

  it('the F-based region is wider for small groups and tends to the chi-square one', () => {
    const chi = confidenceEllipse(group, { level: 0.95, basis: 'chi2' }).q;
    expect(confidenceEllipse(group, { level: 0.95, basis: 'f', n: 10 }).q).toBeGreaterThan(chi * 1.3);
    expect(confidenceEllipse(group, { level: 0.95, basis: 'f', n: 1e6 }).q).toBeCloseTo(chi, 3);
    expect(() => confidenceEllipse(group, { level: 0.95, basis: 'f', n: 2 })).toThrow(GroupTooSmallError);
  });
});
