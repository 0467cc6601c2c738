import { leaveOneOutDistance, pChiSquare, pHotelling } from '../distances/membership';
import { InvalidInputError } from '../errors/engine-errors';
import { squaredDistance } from '../linalg/cholesky';
import type { Matrix } from '../linalg/matrix';
import type { GroupModel } from '../stats/group-model';
import { decideVerdict, type ProbabilityBasis, type VerdictResult } from '../verdicts/verdict';

/** What happened to a member left out of its own group. */
export type LeaveOneOutOutcome = 'own_group' | 'other_group' | 'ambiguous' | 'unassigned';

export interface MemberCheck {
  readonly group: string;
  /** Index of the member within its group's rows. */
  readonly index: number;
  /** D² to its own group with itself included. */
  readonly d2: number;
  /** D² to its own group fitted without it (closed form, no refit). */
  readonly d2LeaveOneOut: number;
  readonly pChi2LeaveOneOut: number;
  readonly pHotellingLeaveOneOut: number;
  /** The verdict with the member left out of its own group (other groups as for any new sample). */
  readonly verdict: VerdictResult;
  readonly outcome: LeaveOneOutOutcome;
}

export interface LeaveOneOutCheck {
  readonly members: MemberCheck[];
  /** confusion[own][assigned group or 'ambiguous' or 'unassigned'] = count. */
  readonly confusion: Record<string, Record<string, number>>;
  readonly returnedToOwnGroup: number;
}

/**
 * Leave-one-out (jackknife) verdicts for every member of every group, in one pass without refits
 * (METHODS.md §1). A robust (MCD) model is the classical estimate of its reweighted support, so the
 * closed form applies with n = support size to members in the support; members outside it did not
 * enter the estimate and are tested as new observations already.
 */
export function leaveOneOutCheck(
  models: readonly GroupModel[],
  groupRows: readonly Matrix[],
  basis: ProbabilityBasis,
  alpha: number,
): LeaveOneOutCheck {
  if (models.length !== groupRows.length)
    throw new InvalidInputError('one set of member rows is needed per group model');
  const names = models.map((m) => m.name);
  const p = models[0]?.mean.length ?? 0;
  const members: MemberCheck[] = [];
  const confusion: Record<string, Record<string, number>> = {};
  for (const name of names)
    confusion[name] = Object.fromEntries([...names, 'ambiguous', 'unassigned'].map((key) => [key, 0]));
  models.forEach((own, k) => {
    groupRows[k].forEach((row, index) => {
      const d2 = models.map((m) => squaredDistance(m.cholesky.lower, row, m.mean));
      const inEstimate = own.mcd ? own.mcd.support[index] : true;
      const d2LeaveOneOut = inEstimate ? leaveOneOutDistance(d2[k], own.effectiveN, p, own.name) : d2[k];
      const ownSize = inEstimate ? own.effectiveN - 1 : own.effectiveN;
      const distances = d2.map((value, j) => (j === k ? d2LeaveOneOut : value));
      const pChi2 = distances.map((value) => pChiSquare(value, p));
      const pHot = distances.map((value, j) =>
        pHotelling(value, j === k ? ownSize : models[j].effectiveN, p, models[j].name),
      );
      const verdict = decideVerdict(names, basis === 'chi2' ? pChi2 : pHot, distances, alpha);
      const outcome: LeaveOneOutOutcome =
        verdict.verdict === 'assigned' ? (verdict.group === own.name ? 'own_group' : 'other_group') : verdict.verdict;
      confusion[own.name][verdict.verdict === 'assigned' ? verdict.group : verdict.verdict]++;
      members.push({
        group: own.name,
        index,
        d2: d2[k],
        d2LeaveOneOut,
        pChi2LeaveOneOut: pChi2[k],
        pHotellingLeaveOneOut: pHot[k],
        verdict,
        outcome,
      });
    });
  });
  return { members, confusion, returnedToOwnGroup: members.filter((m) => m.outcome === 'own_group').length };
}
