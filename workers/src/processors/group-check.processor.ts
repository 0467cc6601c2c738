import {
  DEFAULT_MCD_SEED,
  fitGroup,
  kruskalWallisByVariable,
  leaveOneOutCheck,
  pairwiseHotelling,
} from '@provenote/shared';
import type { RunProcessor } from '../queue/run-worker';
import { prepareSamples, splitByGroup } from './prepare-samples';

/**
 * Group check: every member left out of its own group and judged against all groups, the pairwise
 * separation of the groups (two-sample Hotelling T²) and the Kruskal–Wallis screening per variable.
 */
export const groupCheckProcessor: RunProcessor = async ({ run, store, checkpoint }) => {
  const { parameters } = run;
  await checkpoint(0, 'reading inputs');
  const reference = await store.loadSamples(run.id, 'reference');
  await checkpoint(0.1, 'preparing data');
  const prepared = prepareSamples(reference, parameters);
  const groups = splitByGroup(reference, prepared);
  await checkpoint(0.2, 'fitting reference groups');
  const fitOptions = { covariance: parameters.covariance, seed: run.seed ?? DEFAULT_MCD_SEED };
  const models = groups.map((group) => fitGroup(group.name, group.rows, prepared.variables, fitOptions));
  await checkpoint(0.4, 'leaving each member out');
  const check = leaveOneOutCheck(
    models,
    groups.map((group) => group.rows),
    parameters.probability,
    parameters.alpha,
  );
  await checkpoint(0.7, 'comparing groups');
  const pairs = pairwiseHotelling(groups, prepared.variables);
  const screening = kruskalWallisByVariable(
    groups.map((group) => group.rows),
    prepared.variables,
  );
  const ordinalOf = new Map(groups.map((group) => [group.name, group.ordinals]));
  const ordinals = Int32Array.from(check.members, (member) => ordinalOf.get(member.group)![member.index]);
  await checkpoint(0.85, 'saving results');
  return store.saveGroupCheckResults(run.id, {
    groups: models.map((model) => ({ name: model.name, n: model.n, effectiveN: model.effectiveN })),
    variables: prepared.variables,
    members: {
      ordinals,
      sampleIds: Array.from(ordinals, (ordinal) => reference.sampleIds[ordinal]),
      groups: check.members.map((member) => member.group),
      d2: Float64Array.from(check.members, (member) => member.d2),
      d2LeaveOneOut: Float64Array.from(check.members, (member) => member.d2LeaveOneOut),
      pChi2LeaveOneOut: Float64Array.from(check.members, (member) => member.pChi2LeaveOneOut),
      pHotellingLeaveOneOut: Float64Array.from(check.members, (member) => member.pHotellingLeaveOneOut),
      outcomes: check.members.map((member) => member.outcome),
      bestGroups: check.members.map((member) => member.verdict.group),
    },
    pairs: pairs.map((pair) => ({ ...pair })),
    summary: {
      confusion: check.confusion,
      returnedToOwnGroup: check.returnedToOwnGroup,
      members: ordinals.length,
      kruskalWallis: screening,
    },
  });
};
