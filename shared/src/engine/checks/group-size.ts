import { chiSquareFalseRejectionRate } from '../distributions/false-rejection-rate';

export type SizeStatus = 'ok' | 'warning' | 'error';

export interface GroupSizeAssessment {
  readonly group: string;
  readonly n: number;
  readonly p: number;
  /** From n against p alone: whether the group is small, with the reasons in `messages`. */
  readonly status: SizeStatus;
  readonly messages: string[];
  /** Exact share of true new members the chi-square rule rejects at α (null when n ≤ p). */
  readonly chiSquareFalseRejectionRate: number | null;
  /**
   * The chi-square rule rejects more than twice α of true members. With many variables this holds for
   * groups of ample size too, so it speaks against the χ² basis, not against the group.
   */
  readonly chiSquareOverRejects: boolean;
}

/**
 * How far a group of n members on p variables can be trusted (METHODS.md §1, §5): n > p is a hard
 * minimum (new-observation F), n > p + 1 for the member (Beta) form. Groups of at least five times p
 * are a recommendation of common practice, not of a single source; below it the group is called small.
 * The exact chi-square false-rejection rate is reported beside it, the quantitative reason to prefer
 * the Hotelling basis, which accounts for n exactly.
 */
export function assessGroupSize(
  group: string,
  n: number,
  p: number,
  alpha: number,
  recommendedRatio = 5,
): GroupSizeAssessment {
  const messages: string[] = [];
  if (n <= p) {
    messages.push(`n = ${n} ≤ p = ${p}: the covariance is singular; the group cannot be used`);
    return { group, n, p, status: 'error', messages, chiSquareFalseRejectionRate: null, chiSquareOverRejects: true };
  }
  const rate = chiSquareFalseRejectionRate(n, p, alpha, group);
  if (n <= p + 1) messages.push(`n = ${n} = p + 1: members cannot be tested against their own group (needs n > p + 1)`);
  if (n < recommendedRatio * p) messages.push(`n = ${n} is below ${recommendedRatio}·p = ${recommendedRatio * p}`);
  return {
    group,
    n,
    p,
    status: messages.length > 0 ? 'warning' : 'ok',
    messages,
    chiSquareFalseRejectionRate: rate,
    chiSquareOverRejects: rate > 2 * alpha,
  };
}
