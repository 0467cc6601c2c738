import { chiSquareFalseRejectionRate } from '../distributions/false-rejection-rate';

export type SizeStatus = 'ok' | 'warning' | 'error';

export interface GroupSizeAssessment {
  readonly group: string;
  readonly n: number;
  readonly p: number;
  readonly status: SizeStatus;
  readonly messages: string[];
  /** Exact share of true new members the chi-square rule rejects at α (null when n ≤ p). */
  readonly chiSquareFalseRejectionRate: number | null;
}

/**
 * How far a group of n members on p variables can be trusted (METHODS.md §1, §5): n > p is a hard
 * minimum (new-observation F), n > p + 1 for the member (Beta) form. Groups of at least five times p
 * are a recommendation of common practice, not of a single source; below it the assessment warns, and
 * it shows the exact chi-square false-rejection rate, the quantitative reason.
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
    return { group, n, p, status: 'error', messages, chiSquareFalseRejectionRate: null };
  }
  const rate = chiSquareFalseRejectionRate(n, p, alpha, group);
  if (n <= p + 1) messages.push(`n = ${n} = p + 1: members cannot be tested against their own group (needs n > p + 1)`);
  if (n < recommendedRatio * p) messages.push(`n = ${n} is below ${recommendedRatio}·p = ${recommendedRatio * p}`);
  if (rate > 2 * alpha) {
    messages.push(
      `the chi-square rule would reject ${(100 * rate).toFixed(1)} % of true new members instead of ${100 * alpha} %`,
    );
  }
  return { group, n, p, status: messages.length > 0 ? 'warning' : 'ok', messages, chiSquareFalseRejectionRate: rate };
}
