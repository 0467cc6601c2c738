import { describe, expect, it } from 'vitest';
import { assessGroupSize } from './group-size';

describe('assessGroupSize', () => {
  it('refuses n ≤ p', () => {
    expect(assessGroupSize('A', 4, 4, 0.05).status).toBe('error');
  });

  it('warns on small groups and shows the chi-square false-rejection rate (~27 % for n = 12, p = 4)', () => {
    const result = assessGroupSize('A', 12, 4, 0.05);
    expect(result.status).toBe('warning');
    expect(result.chiSquareFalseRejectionRate).toBeGreaterThan(0.26);
    expect(result.messages).toEqual(['n = 12 is below 5·p = 20']);
    expect(result.chiSquareOverRejects).toBe(true);
  });

  it('is ok for a large group', () => {
    const result = assessGroupSize('A', 400, 4, 0.05);
    expect(result.status).toBe('ok');
    expect(result.chiSquareOverRejects).toBe(false);
  });

  it('does not call a group of 48 on 9 variables small, though the chi-square rule over-rejects there', () => {
    const result = assessGroupSize('A', 48, 9, 0.05);
    expect(result).toMatchObject({ status: 'ok', messages: [], chiSquareOverRejects: true });
    // P[F(9, 39) > 48·39/(9·49·47) · χ²_9(0.95)], χ²_9(0.95) = 16.919 (NIST/SEMATECH e-Handbook §1.3.6.7.4).
    expect(result.chiSquareFalseRejectionRate).toBeGreaterThan(0.1);
  });
});
