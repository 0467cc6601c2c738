import { describe, expect, it } from 'vitest';
import { formatOptionalProbability, formatProbability } from './probability';

describe('formatProbability', () => {
  it('gives three significant digits from 0.001 up', () => {
    expect(formatProbability(1)).toBe('1.00');
    expect(formatProbability(0.41)).toBe('0.410');
    expect(formatProbability(0.012345)).toBe('0.0123');
    expect(formatProbability(0.001)).toBe('0.00100');
  });

  it('switches to exponent form below 0.001', () => {
    expect(formatProbability(0.000999)).toBe('9.99e-4');
    expect(formatProbability(3.14159e-12)).toBe('3.14e-12');
    expect(formatProbability(5e-324)).toBe('4.94e-324');
  });

  it('states an underflow to 0 as a bound, not as zero', () => {
    expect(formatProbability(0)).toBe('< 1e-300');
  });

  it('refuses what is not a probability', () => {
    expect(() => formatProbability(Number.NaN)).toThrow('Not a probability: NaN');
    expect(() => formatProbability(-0.1)).toThrow(RangeError);
    expect(() => formatProbability(1.5)).toThrow(RangeError);
  });

  it('shows a dash for a missing probability', () => {
    expect(formatOptionalProbability(null)).toBe('—');
    expect(formatOptionalProbability(0.5)).toBe('0.500');
  });
});
