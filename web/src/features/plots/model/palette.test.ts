import { describe, expect, it } from 'vitest';
import { groupColours, groupStyle, groupSymbols } from './palette';

describe('group styles', () => {
  it('gives every one of the first 64 groups its own colour and shape pair', () => {
    const pairs = new Set(Array.from({ length: 64 }, (_, i) => JSON.stringify(groupStyle(i))));
    expect(pairs.size).toBe(64);
  });

  it('gives the first eight groups eight different colours and eight different shapes', () => {
    const first = Array.from({ length: 8 }, (_, i) => groupStyle(i));
    expect(new Set(first.map((s) => s.colour)).size).toBe(groupColours.length);
    expect(new Set(first.map((s) => s.symbol)).size).toBe(groupSymbols.length);
  });

  it('refuses an index that is not a group position', () => {
    expect(() => groupStyle(-1)).toThrow(/whole number/);
    expect(() => groupStyle(1.5)).toThrow(/whole number/);
  });
});
