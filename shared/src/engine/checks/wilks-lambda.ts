import { chiSquareUpperTail } from '../distributions/upper-tails';
import { InvalidInputError } from '../errors/engine-errors';
import { cholesky } from '../linalg/cholesky';
import type { Matrix } from '../linalg/matrix';
import { columnMeans, crossProducts } from '../stats/moments';

export interface WilksLambda {
  readonly lambda: number;
  /** Bartlett's approximation −(N − 1 − (p + g)/2) ln Λ ~ χ²_{p(g−1)}. */
  readonly chi2: number;
  readonly df: number;
  readonly p: number;
}

/** Within-group SSCP W = Σₖ Σᵢ (x − x̄ₖ)(x − x̄ₖ)ᵀ and between-group B = T − W, T about the grand mean. */
export function scatterMatrices(groups: readonly Matrix[]): {
  within: number[][];
  between: number[][];
  total: number[][];
} {
  const all = groups.flat();
  const total = crossProducts(all, columnMeans(all));
  const p = total.length;
  const within = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (const rows of groups) {
    const sscp = crossProducts(rows, columnMeans(rows));
    for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) within[j][k] += sscp[j][k];
  }
  const between = total.map((row, j) => row.map((value, k) => value - within[j][k]));
  return { within, between, total };
}

/**
 * Wilks' Λ = |W| / |W + B| for a set of variables (Wilks 1932, Biometrika 24:471), from the Cholesky
 * log-determinants; with Bartlett's χ² approximation (a textbook result, quoted from memory: any
 * multivariate text). Small Λ: the groups are well separated on these variables.
 */
export function wilksLambda(groups: readonly Matrix[], variables: readonly string[]): WilksLambda {
  const n = groups.reduce((s, g) => s + g.length, 0);
  const p = variables.length;
  const g = groups.length;
  if (g < 2 || n - g < p)
    throw new InvalidInputError(`Wilks' Λ needs at least two groups and N − g ≥ p (N = ${n}, g = ${g}, p = ${p})`);
  const { within, total } = scatterMatrices(groups);
  const logLambda =
    cholesky(within, { group: 'within-group scatter', variables }).logDet -
    cholesky(total, { group: 'total scatter', variables }).logDet;
  const chi2 = -(n - 1 - (p + g) / 2) * logLambda;
  const df = p * (g - 1);
  return { lambda: Math.exp(logLambda), chi2, df, p: chiSquareUpperTail(Math.max(chi2, 0), df) };
}
