import { GroupTooSmallError } from '../errors/engine-errors';
import { chiSquareQuantile } from './quantiles';
import { fUpperTail } from './upper-tails';

/**
 * Exact probability that the chi-square rule at level α rejects a true new member of a normal group
 * of n reference members on p variables: P[F(p, n−p) > n(n−p)/(p(n+1)(n−1)) · χ²_p(1−α)] (the
 * new-observation F law of NIST/SEMATECH e-Handbook §6.5.4.3 applied to the chi-square cut-off).
 * For large n it tends to α; for small groups it is far larger, which the product shows beside them.
 */
export function chiSquareFalseRejectionRate(n: number, p: number, alpha: number, group = 'group'): number {
  if (!(n > p)) throw new GroupTooSmallError(group, n, p, p + 1, 'the new-observation F distribution');
  const cutoff = chiSquareQuantile(1 - alpha, p);
  const scale = (n * (n - p)) / (p * (n + 1) * (n - 1));
  return fUpperTail(scale * cutoff, p, n - p);
}
