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
    expect(result.messages.join(' ')).toMatch(/below 5·p = 20/);
  });

  it('is ok for a large group', () => {
    expect(assessGroupSize('A', 400, 4, 0.05).status).toBe('ok');
  });
});
