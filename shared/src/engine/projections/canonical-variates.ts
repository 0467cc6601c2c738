import { InvalidInputError } from '../errors/engine-errors';
import { cholesky } from '../linalg/cholesky';
import { transpose, type Matrix } from '../linalg/matrix';
import { scatterMatrices } from '../checks/wilks-lambda';
import { symmetricEigen } from './symmetric-eigen';

export interface CanonicalVariates {
  /** Eigenvalues of W⁻¹B, largest first, min(p, g − 1) of them. */
  readonly eigenvalues: number[];
  readonly proportionOfTrace: number[];
  /** coefficients[c] over the variables; scores have unit pooled within-group variance. */
  readonly coefficients: number[][];
}

/**
 * Canonical variates (Fisher 1936; Rao 1948): the directions a that maximise between- over
 * within-group variance, the eigenvectors of W⁻¹B. W⁻¹B is not symmetric, so with W = L·Lᵀ the
 * symmetric M = L⁻¹ B L⁻ᵀ is decomposed instead (same eigenvalues) and a = L⁻ᵀ v. Scaled by √(N − g)
 * so the scores have unit pooled within-group variance.
 */
export function canonicalVariates(groups: readonly Matrix[], variables: readonly string[]): CanonicalVariates {
  const n = groups.reduce((s, g) => s + g.length, 0);
  const p = variables.length;
  if (groups.length < 2 || n - groups.length < p) {
    throw new InvalidInputError(
      `canonical variates need two or more groups and N − g ≥ p (N = ${n}, g = ${groups.length}, p = ${p})`,
    );
  }
  const { within, between } = scatterMatrices(groups);
  const { lower } = cholesky(within, { group: 'within-group scatter', variables });
  // Z = L⁻¹ B by forward substitution on each column of B, then M = L⁻¹ Zᵀ = L⁻¹ B L⁻ᵀ (B symmetric).
  const forward = (columns: number[][]): number[][] =>
    columns.map((b) => {
      const y = new Array<number>(p);
      for (let j = 0; j < p; j++) {
        let sum = b[j];
        for (let k = 0; k < j; k++) sum -= lower[j][k] * y[k];
        y[j] = sum / lower[j][j];
      }
      return y;
    });
  const m = forward(transpose(forward(between)));
  const symmetric = m.map((row, i) => row.map((value, j) => (value + m[j][i]) / 2));
  const { values, vectors } = symmetricEigen(symmetric);
  const r = Math.min(p, groups.length - 1);
  const scaleToUnit = Math.sqrt(n - groups.length);
  const coefficients = vectors.slice(0, r).map((v) => {
    // a = L⁻ᵀ v by back substitution.
    const a = new Array<number>(p);
    for (let j = p - 1; j >= 0; j--) {
      let sum = v[j];
      for (let k = j + 1; k < p; k++) sum -= lower[k][j] * a[k];
      a[j] = sum / lower[j][j];
    }
    return a.map((value) => value * scaleToUnit);
  });
  const eigenvalues = values.slice(0, r).map((v) => Math.max(v, 0));
  const trace = eigenvalues.reduce((s, v) => s + v, 0);
  return { eigenvalues, proportionOfTrace: eigenvalues.map((v) => v / trace), coefficients };
}
