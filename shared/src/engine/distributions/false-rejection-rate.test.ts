import { describe, expect, it } from 'vitest';
import { GroupTooSmallError } from '../errors/engine-errors';
import { chiSquareFalseRejectionRate } from './false-rejection-rate';

describe('chiSquareFalseRejectionRate', () => {
  it('is about 27 % for n = 12, p = 4, α = 0.05 (METHODS.md §1, verified there by simulation)', () => {
    const rate = chiSquareFalseRejectionRate(12, 4, 0.05);
    expect(rate).toBeGreaterThan(0.26);
    expect(rate).toBeLessThan(0.28);
  });

  it('tends to α for large groups', () => {
    expect(chiSquareFalseRejectionRate(1e6, 4, 0.05)).toBeCloseTo(0.05, 4);
  });

  it('names the group when n ≤ p', () => {
    expect(() => chiSquareFalseRejectionRate(4, 4, 0.05, 'Quarry A')).toThrow(GroupTooSmallError);
    expect(() => chiSquareFalseRejectionRate(4, 4, 0.05, 'Quarry A')).toThrow(/Quarry A.*n = 4.*p = 4/);
  });
});
