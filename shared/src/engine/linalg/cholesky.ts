import { SingularCovarianceError } from '../errors/engine-errors';
import type { Matrix } from './matrix';

/**
 * Smallest accepted share of a variable's variance that is not explained by the variables before it
 * (1 − R² of the regression on them, the squared Cholesky pivot over the diagonal entry). Below it the
 * covariance has a condition number beyond about 1e10, so D² would keep fewer than 6 of 16 digits.
 */
export const SINGULARITY_TOLERANCE = 1e-10;

export interface CholeskyFactor {
  /** Lower-triangular L with S = L·Lᵀ, as rows. */
  readonly lower: number[][];
  /** log |S| = 2 Σ log Lⱼⱼ. */
  readonly logDet: number;
}

export interface CovarianceContext {
  readonly group: string;
  readonly variables: readonly string[];
}

type Factorisation = CholeskyFactor | { readonly failedAt: number; readonly lower: number[][] };

function factorise(s: Matrix): Factorisation {
  const p = s.length;
  const lower = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  let logDet = 0;
  for (let j = 0; j < p; j++) {
    const row = lower[j];
    for (let k = 0; k < j; k++) {
      let sum = s[j][k];
      const rowK = lower[k];
      for (let m = 0; m < k; m++) sum -= row[m] * rowK[m];
      row[k] = sum / rowK[k];
    }
    let pivot = s[j][j];
    for (let m = 0; m < j; m++) pivot -= row[m] * row[m];
    if (!(s[j][j] > 0) || !(pivot > SINGULARITY_TOLERANCE * s[j][j])) return { failedAt: j, lower };
    row[j] = Math.sqrt(pivot);
    logDet += 2 * Math.log(row[j]);
  }
  return { lower, logDet };
}

/**
 * Cholesky–Banachiewicz factorisation of a symmetric positive definite matrix (Golub & Van Loan,
 * Matrix Computations, 4th ed., §4.2). Refuses near-singular input with an error naming the
 * variable that is (almost) a linear combination of the earlier ones, and those it depends on.
 */
export function cholesky(s: Matrix, context: CovarianceContext): CholeskyFactor {
  const result = factorise(s);
  if (!('failedAt' in result)) return result;
  const j = result.failedAt;
  if (!(s[j][j] > 0)) {
    const name = context.variables[j] ?? `variable ${j + 1}`;
    throw new SingularCovarianceError(context.group, [name], `variable "${name}" has zero variance (constant)`);
  }
  throw dependencyError(s, result.lower, j, context);
}

/** The same factorisation for search algorithms (FAST-MCD) that skip singular candidates: null then. */
export function choleskyOrNull(s: Matrix): CholeskyFactor | null {
  const result = factorise(s);
  return 'failedAt' in result ? null : result;
}

/**
 * Names the variables behind a failed pivot: the regression of variable j on the earlier ones,
 * β = S₁₁⁻¹ s₁₂, solved from the rows of L already computed (L₁₁ᵀ β = L[j, 0..j−1]).
 */
function dependencyError(s: Matrix, lower: number[][], j: number, context: CovarianceContext): SingularCovarianceError {
  const y = lower[j].slice(0, j);
  const beta = new Array<number>(j).fill(0);
  for (let k = j - 1; k >= 0; k--) {
    let sum = y[k];
    for (let m = k + 1; m < j; m++) sum -= lower[m][k] * beta[m];
    beta[k] = sum / lower[k][k];
  }
  const sdJ = Math.sqrt(s[j][j]);
  const standardised = beta.map((b, k) => Math.abs((b * Math.sqrt(s[k][k])) / sdJ));
  const largest = Math.max(...standardised);
  const involved = standardised.flatMap((value, k) => (value > 1e-6 * largest ? [k] : []));
  const name = (k: number): string => context.variables[k] ?? `variable ${k + 1}`;
  const names = [...involved.map(name), name(j)];
  // Closure: when the parts sum to a constant, each coefficient of the dependent part is −1.
  const closed = involved.length === j && j > 0 && beta.every((b) => Math.abs(b + 1) < 1e-6);
  const detail =
    `"${name(j)}" is a linear combination of ${involved.map((k) => `"${name(k)}"`).join(', ') || 'the others'}` +
    (closed
      ? '; the variables sum to a constant (a closed composition): use a log-ratio transform (alr, clr or ilr)'
      : '');
  return new SingularCovarianceError(context.group, names, detail);
}

/**
 * Whitened residual z = L⁻¹(x − mean) by forward substitution; D² = Σ zⱼ² without any explicit inverse.
 * Writes into `out` and returns it.
 */
export function whiten(lower: Matrix, x: readonly number[], mean: readonly number[], out: number[]): number[] {
  const p = lower.length;
  for (let j = 0; j < p; j++) {
    const row = lower[j];
    let sum = x[j] - mean[j];
    for (let k = 0; k < j; k++) sum -= row[k] * out[k];
    out[j] = sum / row[j];
  }
  return out;
}

/** Squared Mahalanobis distance (x − mean)ᵀ S⁻¹ (x − mean) from the Cholesky factor of S. */
export function squaredDistance(lower: Matrix, x: readonly number[], mean: readonly number[]): number {
  const z = whiten(lower, x, mean, new Array<number>(lower.length));
  let d2 = 0;
  for (const value of z) d2 += value * value;
  return d2;
}
