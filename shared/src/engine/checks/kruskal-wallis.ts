import { chiSquareUpperTail } from '../distributions/upper-tails';
import { InvalidInputError } from '../errors/engine-errors';
import type { Matrix } from '../linalg/matrix';

export interface KruskalWallis {
  /** Tie-corrected H. */
  readonly h: number;
  readonly df: number;
  /** P[χ²_{g−1} > H], the usual large-sample approximation. */
  readonly p: number;
}

/**
 * Kruskal–Wallis H across groups (Kruskal & Wallis 1952, JASA 47:583): H = 12/(N(N+1)) Σ Rᵢ²/nᵢ −
 * 3(N+1) on mid-ranks, divided by 1 − Σ(t³−t)/(N³−N) for ties. Undefined (refused) when every value
 * is equal or fewer than two groups are given.
 */
export function kruskalWallis(groups: readonly (readonly number[])[]): KruskalWallis {
  if (groups.length < 2 || groups.some((g) => g.length === 0)) {
    throw new InvalidInputError('Kruskal–Wallis needs at least two non-empty groups');
  }
  const values = groups.flatMap((g, k) => g.map((value) => ({ value, k })));
  if (values.some(({ value }) => !Number.isFinite(value)))
    throw new InvalidInputError('Kruskal–Wallis needs finite values');
  values.sort((a, b) => a.value - b.value);
  const n = values.length;
  const rankSums = new Array<number>(groups.length).fill(0);
  let tieTerm = 0;
  for (let start = 0; start < n;) {
    let end = start;
    while (end + 1 < n && values[end + 1].value === values[start].value) end++;
    const midRank = (start + end) / 2 + 1;
    for (let i = start; i <= end; i++) rankSums[values[i].k] += midRank;
    const t = end - start + 1;
    tieTerm += t * t * t - t;
    start = end + 1;
  }
  const correction = 1 - tieTerm / (n * n * n - n);
  if (!(correction > 0)) throw new InvalidInputError('Kruskal–Wallis is undefined when every value is equal');
  const raw = (12 / (n * (n + 1))) * rankSums.reduce((s, r, k) => s + (r * r) / groups[k].length, 0) - 3 * (n + 1);
  const h = raw / correction;
  const df = groups.length - 1;
  return { h, df, p: chiSquareUpperTail(Math.max(h, 0), df) };
}

/** H for each variable (column) across groups of rows. */
export function kruskalWallisByVariable(
  groups: readonly Matrix[],
  variables: readonly string[],
): (KruskalWallis & { variable: string })[] {
  return variables.map((variable, j) => ({
    variable,
    ...kruskalWallis(groups.map((rows) => rows.map((row) => row[j]))),
  }));
}
