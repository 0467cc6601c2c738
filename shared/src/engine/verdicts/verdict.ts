import { InvalidInputError } from '../errors/engine-errors';

export type ProbabilityBasis = 'chi2' | 'hotelling';
export type Verdict = 'assigned' | 'ambiguous' | 'unassigned';

export interface VerdictResult {
  /** assigned: exactly one group has p ≥ α; ambiguous: two or more; unassigned: none. */
  readonly verdict: Verdict;
  /** The group with the highest probability (smallest D² breaks ties), reported for every verdict. */
  readonly group: string;
  readonly probability: number;
  /** The second best group; null when there is only one group. */
  readonly runnerUp: string | null;
  readonly runnerUpProbability: number | null;
  /** Every group with p ≥ α, best first. */
  readonly groupsAtOrAboveAlpha: string[];
}

/**
 * The verdict for one sample from its membership probabilities (one per group) at level α. Ties in
 * probability (two far outliers both at 0, say) are broken by the smaller D².
 */
export function decideVerdict(
  groups: readonly string[],
  probabilities: ArrayLike<number>,
  d2: ArrayLike<number>,
  alpha: number,
): VerdictResult {
  if (!(alpha > 0 && alpha < 1)) throw new InvalidInputError(`α must lie strictly between 0 and 1, got ${alpha}`);
  if (groups.length === 0 || probabilities.length !== groups.length || d2.length !== groups.length) {
    throw new InvalidInputError('a verdict needs one probability and one D² per group');
  }
  const order = groups.map((_, k) => k).sort((a, b) => probabilities[b] - probabilities[a] || d2[a] - d2[b]);
  const above = order.filter((k) => probabilities[k] >= alpha);
  const verdict: Verdict = above.length === 0 ? 'unassigned' : above.length === 1 ? 'assigned' : 'ambiguous';
  const [best, second] = order;
  return {
    verdict,
    group: groups[best],
    probability: probabilities[best],
    runnerUp: second === undefined ? null : groups[second],
    runnerUpProbability: second === undefined ? null : probabilities[second],
    groupsAtOrAboveAlpha: above.map((k) => groups[k]),
  };
}
