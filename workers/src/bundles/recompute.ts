import {
  applyTransform,
  classifySamples,
  fitGroup,
  leaveOneOutCheck,
  pairwiseHotelling,
  toDistanceCoordinates,
  type AssignmentParameters,
  type TransformSpec,
} from '@provenote/shared';
import type { DistanceRow, GroupContent, MemberRow, SampleRole, SeparationRow } from './bundle-content';

/** Prepared (normalised, imputed) values, one row per sample in the order of `elements`. */
export interface PreparedSamples {
  readonly elements: readonly string[];
  readonly samples: readonly { sampleId: string; role: SampleRole; group: string | null; values: number[] }[];
}

export interface ComputedAssignment {
  readonly sampleId: string;
  readonly verdict: 'assigned' | 'ambiguous' | 'unassigned';
  readonly group: string;
  readonly probability: number;
  readonly runnerUp: string | null;
  readonly runnerUpProbability: number | null;
}

export interface RecomputedRun {
  /** Per sample (order of the input), per element: the transformed coordinate, null where there is none. */
  readonly transformed: (number | null)[][];
  readonly groups: Omit<GroupContent, 'version'>[];
  readonly distances: DistanceRow[];
  readonly assignments: ComputedAssignment[];
  readonly members: MemberRow[];
  readonly separation: SeparationRow[];
}

/** Which transformed coordinate belongs to which element: alr drops its denominator, the pivot coordinates the last part. */
function coordinateOfElement(elements: readonly string[], spec: TransformSpec): (number | null)[] {
  if (spec.transform === 'alr') {
    const denominator = elements.indexOf(spec.alrDenominator ?? elements[elements.length - 1]);
    return elements.map((_, j) => (j === denominator ? null : j < denominator ? j : j - 1));
  }
  if (spec.transform === 'ilr') return elements.map((_, j) => (j < elements.length - 1 ? j : null));
  return elements.map((_, j) => j);
}

/**
 * A run's results from its prepared data and parameters, by the same engine steps as the run queue's
 * processors: the transform, one model per reference group (groups in order of name), every unknown
 * against every group, every member left out of its own group, and the pairwise separation.
 */
export function recomputeRun(prepared: PreparedSamples, parameters: AssignmentParameters, seed: number): RecomputedRun {
  const spec: TransformSpec = { transform: parameters.transform, alrDenominator: parameters.alrDenominator };
  const rows = prepared.samples.map((sample) => sample.values);
  const transformedData = applyTransform(rows, prepared.elements, spec);
  const coordinate = coordinateOfElement(prepared.elements, spec);
  const transformed = transformedData.values.map((row) => coordinate.map((k) => (k === null ? null : row[k])));
  const distanceData = toDistanceCoordinates(transformedData, spec);
  const variables = distanceData.variables;

  const byGroup = new Map<string, { members: string[]; rows: number[][] }>();
  const unknownIds: string[] = [];
  const unknownRows: number[][] = [];
  prepared.samples.forEach((sample, i) => {
    if (sample.role === 'unknown') {
      unknownIds.push(sample.sampleId);
      unknownRows.push(distanceData.values[i]);
      return;
    }
    const entry = byGroup.get(sample.group ?? '') ?? { members: [], rows: [] };
    entry.members.push(sample.sampleId);
    entry.rows.push(distanceData.values[i]);
    byGroup.set(sample.group ?? '', entry);
  });
  const groupList = [...byGroup.entries()]
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([name, entry]) => ({ name, ...entry }));
  const fitOptions = { covariance: parameters.covariance, seed };
  const models = groupList.map((group) => fitGroup(group.name, group.rows, variables, fitOptions));

  const groups = models.map((model, k): Omit<GroupContent, 'version'> => ({
    name: model.name,
    n: model.n,
    effectiveN: model.effectiveN,
    method: model.method,
    members: groupList[k].members,
    variables,
    mean: model.mean,
    covariance: model.covariance,
    robust: model.mcd && {
      seed: model.mcd.seed,
      h: model.mcd.h,
      consistencyFactor: model.mcd.consistencyFactor,
      cutoff: model.mcd.cutoff,
      distances: model.mcd.distances,
      support: model.mcd.support,
    },
  }));

  const distances: DistanceRow[] = [];
  const assignments: ComputedAssignment[] = [];
  if (unknownRows.length > 0) {
    const options = { basis: parameters.probability, alpha: parameters.alpha };
    classifySamples(models, unknownRows, options).forEach((sample, i) => {
      const sampleId = unknownIds[i];
      models.forEach((model, k) =>
        distances.push({
          sampleId,
          group: model.name,
          d2: sample.d2[k],
          pChi2: sample.pChi2[k],
          pHotelling: sample.pHotelling[k],
        }),
      );
      const { verdict, group, probability, runnerUp, runnerUpProbability } = sample.verdict;
      assignments.push({ sampleId, verdict, group, probability, runnerUp, runnerUpProbability });
    });
  }

  const check = leaveOneOutCheck(
    models,
    groupList.map((group) => group.rows),
    parameters.probability,
    parameters.alpha,
  );
  const members = check.members.map((member): MemberRow => ({
    sampleId: groupList[models.findIndex((m) => m.name === member.group)].members[member.index],
    group: member.group,
    d2: member.d2,
    d2Loo: member.d2LeaveOneOut,
    pHotellingLoo: member.pHotellingLeaveOneOut,
    verdictLoo: member.outcome,
  }));
  const separation = pairwiseHotelling(groupList, variables).map((pair): SeparationRow => ({ ...pair }));
  return { transformed, groups, distances, assignments, members, separation };
}
