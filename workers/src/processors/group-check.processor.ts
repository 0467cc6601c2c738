import {
  DEFAULT_MCD_SEED,
  EngineError,
  fastMcd,
  fitGroup,
  kruskalWallisByVariable,
  leaveOneOutCheck,
  mulberry32,
  pairwiseHotelling,
  type GroupModel,
} from '@provenote/shared';
import type { RunProcessor } from '../queue/run-worker';
import { prepareSamples, splitByGroup } from './prepare-samples';

/** One group's robust fit as the card reports it: distances and flags, or why there are none. */
export interface RobustFitOutcome {
  readonly group: string;
  readonly seed: number;
  /** Robust D² per member (in the group's row order), or null when the group was not fitted. */
  readonly d2: number[] | null;
  readonly flagged: boolean[] | null;
  /** The 97.5 % point of robust D² for clean normal groups of this n and p (simulated), or null. */
  readonly cutoff: number | null;
  /** Why a group has no robust fit, in words for the card. */
  readonly note: string | null;
}

/**
 * Fewest members for a robust fit: 2(p + 1), so that the MCD subset (about half the group) still holds
 * more than p + 1 members and an outlying member can fall outside it. Fewer give a fit that says little.
 */
export const minimumRobustFitSize = (p: number) => 2 * (p + 1);

const CALIBRATION_VALUES = 1000;
const calibrations = new Map<string, number>();

/**
 * The 97.5 % point of FAST-MCD robust D² for clean multivariate normal groups of n members and p
 * coordinates, by seeded simulation. The χ²_p(0.975) point holds only for large n: in small groups it
 * flags far too many clean members (Hardin & Rocke 2005, J. Comput. Graph. Stat. 14:928 — here 35 % at
 * n = 34, p = 9). The MCD is affine equivariant, so standard normal data serve for every group of that
 * size; enough replicates are drawn to pool about 1,000 distances (at least ten groups).
 */
export function robustCutoff(n: number, p: number, seed: number): number {
  const key = `${n}:${p}:${seed}`;
  const known = calibrations.get(key);
  if (known !== undefined) return known;
  const random = mulberry32(seed);
  const replicates = Math.max(10, Math.ceil(CALIBRATION_VALUES / n));
  const pooled: number[] = [];
  const context = { group: 'clean-normal calibration', variables: Array.from({ length: p }, (_, j) => `z${j + 1}`) };
  for (let r = 0; r < replicates; r++) {
    const rows = Array.from({ length: n }, () => Array.from({ length: p }, () => random.normal()));
    pooled.push(...fastMcd(rows, { seed: seed + r + 1, context }).distances);
  }
  pooled.sort((a, b) => a - b);
  const cutoff = pooled[Math.ceil(0.975 * pooled.length) - 1];
  calibrations.set(key, cutoff);
  return cutoff;
}

/**
 * FAST-MCD per group whatever covariance the run uses, so the check can name members the classical fit
 * hides. A member is flagged when its robust D² exceeds the simulated 97.5 % point for its group's n and
 * p (robustCutoff), so about 2.5 % of a clean group's members are flagged whatever its size. A run with
 * MCD covariance reuses its fit.
 */
export function robustFit(model: GroupModel, rows: number[][], variables: string[], seed: number): RobustFitOutcome {
  const p = variables.length;
  const minimum = minimumRobustFitSize(p);
  const none = (note: string): RobustFitOutcome => ({
    group: model.name,
    seed,
    d2: null,
    flagged: null,
    cutoff: null,
    note,
  });
  if (rows.length < minimum) {
    return none(
      `${rows.length} members is too few for a robust fit with ${p} coordinates: it needs at least ${minimum}.`,
    );
  }
  try {
    const mcd = model.mcd ?? fastMcd(rows, { seed, context: { group: model.name, variables } });
    const cutoff = robustCutoff(rows.length, p, mcd.seed);
    return {
      group: model.name,
      seed: mcd.seed,
      d2: mcd.distances,
      flagged: mcd.distances.map((d2) => d2 > cutoff),
      cutoff,
      note: null,
    };
  } catch (error) {
    // A group the classical fit accepts can still defeat the MCD (half its members on a hyperplane):
    // the check goes on, and the card says why this group has no robust fit.
    if (error instanceof EngineError) return none(`No robust fit: ${error.message}.`);
    throw error;
  }
}

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
  await checkpoint(0.8, 'robust fit per group');
  const seed = fitOptions.seed;
  const robust = models.map((model, g) => robustFit(model, groups[g].rows, prepared.variables, seed));
  const robustOf = new Map(robust.map((r) => [r.group, r]));
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
      robustD2: check.members.map((member) => robustOf.get(member.group)!.d2?.[member.index] ?? null),
      robustFlagged: check.members.map((member) => robustOf.get(member.group)!.flagged?.[member.index] ?? null),
    },
    pairs: pairs.map((pair) => ({ ...pair })),
    summary: {
      confusion: check.confusion,
      returnedToOwnGroup: check.returnedToOwnGroup,
      members: ordinals.length,
      kruskalWallis: screening,
      robustFit: robust.map(({ group, seed, cutoff, note, flagged }) => ({
        group,
        seed,
        cutoff,
        note,
        flagged: flagged ? flagged.filter(Boolean).length : null,
      })),
    },
  });
};
