import { describe, expect, it } from 'vitest';
import { InvalidInputError } from '../errors/engine-errors';
import { replaceBelowDetectionLimit } from './detection-limit';

describe('multiplicative replacement', () => {
  it('reproduces the worked example of METHODS.md §3 (Martín-Fernández et al. 2003)', () => {
    // Row (0, 0.1250, 0.1237, 0.7253, 0.0260), κ = 1, δ = 0.013 (0.65 × a detection limit of 0.02)
    // → (0.013, 0.123375, 0.122092, 0.715871, 0.025662), six decimals as published there.
    const { values, imputed } = replaceBelowDetectionLimit([[0, 0.125, 0.1237, 0.7253, 0.026]], {
      method: 'multiplicative',
      columnDetectionLimits: [0.02, null, null, null, null],
      closure: 1,
    });
    [0.013, 0.123375, 0.122092, 0.715871, 0.025662].forEach((expected, j) =>
      expect(values[0][j]).toBeCloseTo(expected, 6),
    );
    expect(imputed).toEqual([[true, false, false, false, false]]);
  });

  it('keeps the ratios among the measured parts unchanged', () => {
    const row = [{ belowDetectionLimit: 5 }, 120, 300, 80];
    const { values } = replaceBelowDetectionLimit([row], { method: 'multiplicative', closure: 1e6 });
    expect(values[0][2] / values[0][1]).toBeCloseTo(300 / 120, 14);
    expect(values[0][3] / values[0][2]).toBeCloseTo(80 / 300, 14);
    expect(values[0][0]).toBeCloseTo(0.65 * 5, 14);
  });

  it('refuses replacements that exhaust the closure constant', () => {
    expect(() =>
      replaceBelowDetectionLimit([[{ belowDetectionLimit: 2 }, 0.5]], { method: 'multiplicative', closure: 1 }),
    ).toThrow(InvalidInputError);
  });
});

describe('simple substitution', () => {
  it('uses DL/2 and DL/√2 (Hornung & Reed 1990) and flags every imputed cell', () => {
    const rows = [
      [{ belowDetectionLimit: 0.4 }, 3],
      [1, 0],
    ];
    const half = replaceBelowDetectionLimit(rows, { method: 'dl-half', columnDetectionLimits: [null, 0.1] });
    expect(half.values).toEqual([
      [0.2, 3],
      [1, 0.05],
    ]);
    expect(half.imputed).toEqual([
      [true, false],
      [false, true],
    ]);
    const root = replaceBelowDetectionLimit(rows, { method: 'dl-sqrt2' });
    expect(root.values[0][0]).toBeCloseTo(0.4 / Math.SQRT2, 15);
    // Without a column limit a zero is a real value and stays as it is.
    expect(root.values[1][1]).toBe(0);
    expect(root.imputed[1][1]).toBe(false);
  });
});
