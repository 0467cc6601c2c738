import { fUpperTail } from '../distributions/upper-tails';
import { GroupTooSmallError } from '../errors/engine-errors';
import { cholesky, squaredDistance } from '../linalg/cholesky';
import { assertFiniteMatrix, type Matrix } from '../linalg/matrix';
import { columnMeans } from '../stats/moments';
import { pooledCovariance } from '../stats/pooled-covariance';

export interface TwoSampleHotelling {
  readonly groupA: string;
  readonly groupB: string;
  readonly t2: number;
  readonly f: number;
  readonly df1: number;
  readonly df2: number;
  readonly p: number;
}

/**
 * Two-sample Hotelling T² (Hotelling 1931): T² = n₁n₂/(n₁+n₂) · d̄ᵀ S_pooled⁻¹ d̄ and
 * F = (n₁+n₂−p−1)/(p(n₁+n₂−2)) · T² ~ F(p, n₁+n₂−p−1) (METHODS.md §5). Tests whether two groups share
 * a mean, assuming a common covariance.
 */
export function twoSampleHotelling(
  groupA: string,
  a: Matrix,
  groupB: string,
  b: Matrix,
  variables: readonly string[],
): TwoSampleHotelling {
  const p = variables.length;
  assertFiniteMatrix(a, `group "${groupA}"`, p);
  assertFiniteMatrix(b, `group "${groupB}"`, p);
  const n1 = a.length;
  const n2 = b.length;
  const df2 = n1 + n2 - p - 1;
  if (df2 < 1) throw new GroupTooSmallError(`${groupA} + ${groupB}`, n1 + n2, p, p + 2, 'the two-sample Hotelling T²');
  const pooled = pooledCovariance([a, b]);
  const factor = cholesky(pooled, { group: `${groupA} + ${groupB} (pooled)`, variables });
  const t2 = ((n1 * n2) / (n1 + n2)) * squaredDistance(factor.lower, columnMeans(a), columnMeans(b));
  const f = (df2 / (p * (n1 + n2 - 2))) * t2;
  return { groupA, groupB, t2, f, df1: p, df2, p: fUpperTail(f, p, df2) };
}

/** Every pair of groups, in the order given (a before b). */
export function pairwiseHotelling(
  groups: readonly { name: string; rows: Matrix }[],
  variables: readonly string[],
): TwoSampleHotelling[] {
  return groups.flatMap((a, i) =>
    groups.slice(i + 1).map((b) => twoSampleHotelling(a.name, a.rows, b.name, b.rows, variables)),
  );
}
