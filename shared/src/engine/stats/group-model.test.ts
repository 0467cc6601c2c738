import { describe, expect, it } from 'vitest';
import { GroupTooSmallError, SingularCovarianceError } from '../errors/engine-errors';
import { loadHbk } from '../__fixtures__/load-fixtures.mjs';
import { DEFAULT_MCD_SEED, fitGroup } from './group-model';

describe('fitGroup', () => {
  it('refuses n ≤ p by name, with n and p', () => {
    expect(() =>
      fitGroup(
        'Site 9',
        [
          [1, 2, 3],
          [2, 3, 1],
          [3, 1, 2],
        ],
        ['a', 'b', 'c'],
      ),
    ).toThrow(GroupTooSmallError);
    expect(() =>
      fitGroup(
        'Site 9',
        [
          [1, 2, 3],
          [2, 3, 1],
          [3, 1, 2],
        ],
        ['a', 'b', 'c'],
      ),
    ).toThrow(/"Site 9".*n = 3.*p = 3/);
  });

  it('names a constant variable', () => {
    const rows = [
      [1, 7, 2],
      [2, 7, 1],
      [3, 7, 5],
      [4, 7, 3],
      [6, 7, 2],
    ];
    try {
      fitGroup('Site 9', rows, ['Cu', 'Zn', 'Pb']);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(SingularCovarianceError);
      expect((error as SingularCovarianceError).variables).toEqual(['Zn']);
    }
  });

  it('refuses non-finite input instead of producing NaN', () => {
    expect(() =>
      fitGroup(
        'g',
        [
          [1, Number.NaN],
          [2, 3],
          [4, 1],
          [0, 2],
        ],
        ['a', 'b'],
      ),
    ).toThrow(/row 1, column 2/);
  });

  it('a robust fit records its seed and rests on the reweighted support', () => {
    const { x } = loadHbk();
    const model = fitGroup('hbk', x, ['X1', 'X2', 'X3'], { covariance: 'mcd' });
    expect(model.method).toBe('mcd');
    expect(model.mcd?.seed).toBe(DEFAULT_MCD_SEED);
    expect(model.effectiveN).toBeLessThanOrEqual(75 - 14);
    expect(fitGroup('hbk', x, ['X1', 'X2', 'X3'], { covariance: 'mcd', seed: 77 }).mcd?.seed).toBe(77);
  });
});
