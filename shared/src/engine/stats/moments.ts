import { InvalidInputError } from '../errors/engine-errors';
import type { Matrix } from '../linalg/matrix';

/** Column means. Missing values are not accepted: the caller imputes or drops them first. */
export function columnMeans(rows: Matrix): number[] {
  if (rows.length === 0) throw new InvalidInputError('cannot take the mean of zero rows');
  const p = rows[0].length;
  const mean = new Array<number>(p).fill(0);
  for (const row of rows) for (let j = 0; j < p; j++) mean[j] += row[j];
  return mean.map((sum) => sum / rows.length);
}

/**
 * Sum of squares and cross-products about `centre`, Σ (x − c)(x − c)ᵀ, by the two-pass method (the
 * centre is computed first), which avoids the cancellation of the one-pass Σxxᵀ − n·x̄x̄ᵀ
 * (Chan, Golub & LeVeque 1983, The American Statistician 37:242).
 */
export function crossProducts(rows: Matrix, centre: readonly number[]): number[][] {
  const p = centre.length;
  const sscp = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const residual = new Array<number>(p);
  for (const row of rows) {
    for (let j = 0; j < p; j++) residual[j] = row[j] - centre[j];
    for (let j = 0; j < p; j++) {
      const rj = residual[j];
      const out = sscp[j];
      for (let k = 0; k <= j; k++) out[k] += rj * residual[k];
    }
  }
  for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) sscp[k][j] = sscp[j][k];
  return sscp;
}

/** Unbiased covariance (divisor n − 1). Needs n ≥ 2. */
export function covariance(rows: Matrix, mean: readonly number[] = columnMeans(rows)): number[][] {
  if (rows.length < 2) throw new InvalidInputError(`covariance needs at least 2 rows, got ${rows.length}`);
  return crossProducts(rows, mean).map((row) => row.map((value) => value / (rows.length - 1)));
}
