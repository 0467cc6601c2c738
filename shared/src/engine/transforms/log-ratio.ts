import { InvalidInputError, NonPositiveValueError } from '../errors/engine-errors';
import type { Matrix } from '../linalg/matrix';

/*
 * Log and log-ratio transforms of compositions (Aitchison 1986, The Statistical Analysis of
 * Compositional Data, Chapman & Hall). Every input must be positive: zeros and values below the
 * detection limit are replaced beforehand (see detection-limit.ts); a non-positive value is refused
 * with its row and column rather than turned into −Infinity or NaN.
 */

function logOf(rows: Matrix, log: (x: number) => number): number[][] {
  return rows.map((row, i) =>
    row.map((value, j) => {
      if (!(value > 0) || !Number.isFinite(value)) throw new NonPositiveValueError(i, j, value);
      return log(value);
    }),
  );
}

export function log10Transform(rows: Matrix): number[][] {
  return logOf(rows, Math.log10);
}

export function lnTransform(rows: Matrix): number[][] {
  return logOf(rows, Math.log);
}

function assertParts(rows: Matrix, minimum: number): number {
  const parts = rows.length > 0 ? rows[0].length : 0;
  if (parts < minimum) {
    throw new InvalidInputError(`a log-ratio transform needs at least ${minimum} parts, got ${parts}`);
  }
  return parts;
}

/** Additive log-ratio: ln(xᵢ / x_D) for every part but the chosen denominator D (Aitchison 1986). */
export function alrTransform(rows: Matrix, denominator: number): number[][] {
  const parts = assertParts(rows, 2);
  if (!Number.isInteger(denominator) || denominator < 0 || denominator >= parts) {
    throw new InvalidInputError(`alr denominator index ${denominator} is not one of the ${parts} parts`);
  }
  return lnTransform(rows).map((logs) =>
    logs.flatMap((value, j) => (j === denominator ? [] : [value - logs[denominator]])),
  );
}

/** Centred log-ratio: ln(xᵢ / g(x)), g the geometric mean of the row (Aitchison 1986). */
export function clrTransform(rows: Matrix): number[][] {
  assertParts(rows, 2);
  return lnTransform(rows).map((logs) => {
    const centre = logs.reduce((sum, value) => sum + value, 0) / logs.length;
    return logs.map((value) => value - centre);
  });
}

/**
 * The orthonormal pivot basis V (D rows × D−1 columns) with ilr = clr · V (Egozcue et al. 2003,
 * Mathematical Geology 35:279; pivot form of Filzmoser & Hron 2008, Mathematical Geosciences 40:233):
 * column i has √((D−i)/(D−i+1)) at part i, −√((D−i)/(D−i+1))/(D−i) at each later part, 0 before
 * (i counted from 1).
 */
export function pivotBasis(parts: number): number[][] {
  const basis = Array.from({ length: parts }, () => new Array<number>(parts - 1).fill(0));
  for (let i = 0; i < parts - 1; i++) {
    const rest = parts - i - 1;
    const scale = Math.sqrt(rest / (rest + 1));
    basis[i][i] = scale;
    for (let j = i + 1; j < parts; j++) basis[j][i] = -scale / rest;
  }
  return basis;
}

/** Projects clr rows onto the pivot basis: ilr coordinates in D−1 dimensions. */
export function clrToPivotCoordinates(clrRows: Matrix): number[][] {
  const parts = assertParts(clrRows, 2);
  const basis = pivotBasis(parts);
  return clrRows.map((row) => {
    const out = new Array<number>(parts - 1).fill(0);
    for (let j = 0; j < parts; j++) for (let i = 0; i < parts - 1; i++) out[i] += row[j] * basis[j][i];
    return out;
  });
}

/**
 * Isometric log-ratio in pivot coordinates: zᵢ = √((D−i)/(D−i+1)) · ln(xᵢ / gm(x_{i+1..D})),
 * i = 1…D−1 (Filzmoser & Hron 2008). Computed from the logs directly, in O(D) per row.
 */
export function ilrTransform(rows: Matrix): number[][] {
  const parts = assertParts(rows, 2);
  return lnTransform(rows).map((logs) => {
    const out = new Array<number>(parts - 1);
    let tailSum = 0;
    for (let i = parts - 1; i >= 1; i--) {
      tailSum += logs[i];
      const rest = parts - i;
      out[i - 1] = Math.sqrt(rest / (rest + 1)) * (logs[i - 1] - tailSum / rest);
    }
    return out;
  });
}
