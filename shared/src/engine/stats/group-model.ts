import { GroupTooSmallError, SingularCovarianceError } from '../errors/engine-errors';
import { cholesky, type CholeskyFactor } from '../linalg/cholesky';
import { assertFiniteMatrix, type Matrix } from '../linalg/matrix';
import { fastMcd, type McdResult } from './fast-mcd';
import { columnMeans, covariance } from './moments';

export type CovarianceMethod = 'classic' | 'mcd';

/** Everything the distance and probability functions need about one reference group. */
export interface GroupModel {
  readonly name: string;
  readonly variables: readonly string[];
  /** Number of members given. */
  readonly n: number;
  /**
   * Members the estimate rests on: n for the classical estimate, the reweighted MCD support for the
   * robust one. The F and Beta laws use this count.
   */
  readonly effectiveN: number;
  readonly mean: number[];
  readonly covariance: number[][];
  readonly cholesky: CholeskyFactor;
  readonly method: CovarianceMethod;
  /** For 'mcd': the robust fit with its seed and which members it kept. */
  readonly mcd?: McdResult;
}

export interface FitOptions {
  readonly covariance?: CovarianceMethod;
  /** Seed of the MCD random subsets; recorded in the result. */
  readonly seed?: number;
}

export const DEFAULT_MCD_SEED = 20240601;

/** Refuses constant variables by their values, before rounding in the covariance could hide them. */
function assertNoConstantVariable(name: string, rows: Matrix, variables: readonly string[]): void {
  variables.forEach((variable, j) => {
    if (rows.every((row) => row[j] === rows[0][j])) {
      throw new SingularCovarianceError(
        name,
        [variable],
        `variable "${variable}" is constant (${rows[0][j]}) in every member`,
      );
    }
  });
}

/**
 * Mean, covariance and Cholesky factor of one reference group. A group with n ≤ p members has a
 * singular covariance and is refused by name, as is any constant or collinear variable.
 */
export function fitGroup(
  name: string,
  rows: Matrix,
  variables: readonly string[],
  options: FitOptions = {},
): GroupModel {
  const p = variables.length;
  assertFiniteMatrix(rows, `group "${name}"`, p);
  if (rows.length <= p) throw new GroupTooSmallError(name, rows.length, p, p + 1, 'a non-singular covariance');
  assertNoConstantVariable(name, rows, variables);
  const context = { group: name, variables };
  if ((options.covariance ?? 'classic') === 'mcd') {
    const mcd = fastMcd(rows, { seed: options.seed ?? DEFAULT_MCD_SEED, context });
    return {
      name,
      variables,
      n: rows.length,
      effectiveN: mcd.support.filter(Boolean).length,
      mean: mcd.mean,
      covariance: mcd.covariance,
      cholesky: cholesky(mcd.covariance, context),
      method: 'mcd',
      mcd,
    };
  }
  const mean = columnMeans(rows);
  const cov = covariance(rows, mean);
  return {
    name,
    variables,
    n: rows.length,
    effectiveN: rows.length,
    mean,
    covariance: cov,
    cholesky: cholesky(cov, context),
    method: 'classic',
  };
}
