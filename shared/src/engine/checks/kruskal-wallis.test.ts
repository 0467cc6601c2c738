import { describe, expect, it } from 'vitest';
import { InvalidInputError } from '../errors/engine-errors';
import { kruskalWallis, kruskalWallisByVariable } from './kruskal-wallis';

describe('kruskalWallis', () => {
  it('reproduces the scipy.stats.kruskal documentation example (METHODS.md §5)', () => {
    // Source: scipy.stats.kruskal documentation: H = 7.113812154696133, p = 0.028526948491942164.
    const result = kruskalWallis([
      [6.3, 5.4, 5.7, 5.2, 5.0],
      [6.9, 7.0, 6.1, 7.9],
      [7.2, 6.9, 6.1, 6.5],
    ]);
    expect(result.h).toBeCloseTo(7.113812154696133, 12);
    expect(result.p).toBeCloseTo(0.028526948491942164, 12);
    expect(result.df).toBe(2);
  });

  it('without ties H equals the textbook formula computed by hand', () => {
    // Ranks: group 1 {1, 2, 3}, group 2 {4, 5, 6}; H = 12/(6·7)·(36/3 + 225/3) − 21 = 27/7.
    expect(
      kruskalWallis([
        [1, 2, 3],
        [4, 5, 6],
      ]).h,
    ).toBeCloseTo(27 / 7, 13);
  });

  it('refuses all-equal values instead of dividing by zero', () => {
    expect(() =>
      kruskalWallis([
        [1, 1],
        [1, 1],
      ]),
    ).toThrow(InvalidInputError);
  });

  it('runs per variable', () => {
    const rows = kruskalWallisByVariable(
      [
        [
          [1, 5],
          [2, 6],
        ],
        [
          [3, 1],
          [4, 2],
        ],
      ],
      ['Cu', 'Zn'],
    );
    expect(rows.map((r) => r.variable)).toEqual(['Cu', 'Zn']);
    expect(rows[0].h).toBeCloseTo(rows[1].h, 14);
  });
});
