import { betaUpperTail, chiSquareUpperTail, fUpperTail } from '../distributions/upper-tails';
import { GroupTooSmallError, InvalidInputError } from '../errors/engine-errors';

/*
 * Membership (typicality) probabilities of a squared Mahalanobis distance D² to a group of n members on
 * p variables (METHODS.md §1). They answer "is this sample typical of this group?" one group at a time
 * and need not sum to 1 over groups.
 */

function assertDistance(d2: number): void {
  if (Number.isNaN(d2) || d2 < 0) throw new InvalidInputError(`D² must be a non-negative number, got ${d2}`);
}

/** Asymptotic: D² ~ χ²_p (Mahalanobis 1936), exact only when the group mean and covariance are known. */
export function pChiSquare(d2: number, p: number): number {
  assertDistance(d2);
  return chiSquareUpperTail(d2, p);
}

/**
 * F statistic of a new observation (not a member): n(n−p)/(p(n+1)(n−1)) · D² ~ F(p, n−p)
 * (NIST/SEMATECH e-Handbook §6.5.4.3; Tracy, Young & Mason 1992, J. Quality Technology 24:88).
 */
export function newObservationF(d2: number, n: number, p: number, group = 'group'): number {
  assertDistance(d2);
  if (!(n > p)) throw new GroupTooSmallError(group, n, p, p + 1, 'the new-observation F distribution');
  return ((n * (n - p)) / (p * (n + 1) * (n - 1))) * d2;
}

/** P-value of a new observation under the F law above. */
export function pHotelling(d2: number, n: number, p: number, group = 'group'): number {
  return fUpperTail(newObservationF(d2, n, p, group), p, n - p);
}

/**
 * In-sample form for a member that helped build the mean and covariance: n·D²/(n−1)² ~
 * Beta(p/2, (n−p−1)/2) (Tracy, Young & Mason 1992; Penny 1996, Applied Statistics 45:73). A member's D²
 * cannot exceed (n−1)²/n, so a larger value means the sample was not a member.
 */
export function pMemberBeta(d2: number, n: number, p: number, group = 'group'): number {
  assertDistance(d2);
  if (!(n > p + 1)) throw new GroupTooSmallError(group, n, p, p + 2, 'the in-sample Beta distribution');
  const b = (n * d2) / ((n - 1) * (n - 1));
  if (b > 1 + 1e-12)
    throw new InvalidInputError(`D² = ${d2} exceeds (n−1)²/n = ${((n - 1) * (n - 1)) / n}: not a member of "${group}"`);
  return betaUpperTail(Math.min(b, 1), p / 2, (n - p - 1) / 2);
}

/**
 * Leave-one-out D² of member i from its full-group D²ᵢ without refitting:
 * D²₍₋ᵢ₎ = n²(n−2)·D²ᵢ / ((n−1)·((n−1)² − n·D²ᵢ)) (METHODS.md §1; from the Sherman–Morrison rank-one
 * downdate of S with leverage hᵢᵢ = 1/n + D²ᵢ/(n−1)).
 */
export function leaveOneOutDistance(d2: number, n: number, p: number, group = 'group'): number {
  assertDistance(d2);
  if (!(n - 1 > p)) throw new GroupTooSmallError(group, n, p, p + 2, 'leave-one-out distances');
  const room = (n - 1) * (n - 1) - n * d2;
  if (!(room > 0)) {
    throw new InvalidInputError(
      `D² = ${d2} reaches (n−1)²/n: removing this member leaves "${group}" with a singular covariance`,
    );
  }
  return (n * n * (n - 2) * d2) / ((n - 1) * room);
}

/** The left-out member as a new observation against the other n − 1: F(p, n−1−p). */
export function pHotellingLeaveOneOut(d2: number, n: number, p: number, group = 'group'): number {
  return pHotelling(leaveOneOutDistance(d2, n, p, group), n - 1, p, group);
}
