import { z } from 'zod';

/** The notebook's step cards, top to bottom; a card's inputs are the results of the cards above it. */
export const stepKeys = ['data', 'prepare', 'groups', 'check', 'assign', 'review', 'export'] as const;
export const stepKeySchema = z.enum(stepKeys);
export type StepKey = z.infer<typeof stepKeySchema>;

/**
 * - not_run: nothing saved or computed yet;
 * - running: a run on the queue is computing this card's results;
 * - current: the card's settings (and results, where it has any) follow from the cards above as they are now;
 * - stale: a card above changed after this one was saved or computed, so it should be run again;
 * - failed: the last run of this card ended with an error.
 */
export const stepStatuses = ['not_run', 'running', 'current', 'stale', 'failed'] as const;
export const stepStatusSchema = z.enum(stepStatuses);
export type StepStatus = z.infer<typeof stepStatusSchema>;

export const stepLabels: Record<StepKey, { title: string; summary: string }> = {
  data: { title: 'Data', summary: 'Pick the reference data and the unknowns (pinned dataset versions).' },
  prepare: { title: 'Prepare', summary: 'Choose elements, transform, below-detection handling and covariance.' },
  groups: { title: 'Reference groups', summary: 'Choose the reference group versions to assign against.' },
  check: { title: 'Group check', summary: 'Leave-one-out check of every member and the separation of groups.' },
  assign: { title: 'Assign', summary: 'Assign the unknowns to the groups on the run queue.' },
  review: { title: 'Review', summary: 'Override verdicts with a written reason; the PI signs the study off.' },
  export: { title: 'Export', summary: 'Build a result bundle anyone can verify without Provenote.' },
};

export const stepStatusLabels: Record<StepStatus, string> = {
  not_run: 'Not run',
  running: 'Running',
  current: 'Current',
  stale: 'Stale',
  failed: 'Failed',
};

/** Cards whose results come from a run on the queue; the others hold settings only. */
export const computedStepKeys: readonly StepKey[] = ['check', 'assign', 'export'];
export const isComputedStep = (key: StepKey) => computedStepKeys.includes(key);

export const stepPosition = (key: StepKey) => stepKeys.indexOf(key);

export interface StepState {
  key: StepKey;
  status: StepStatus;
  /** The run that produced (or is producing) this card's results. */
  runId: string | null;
}

function requireKnownSteps(steps: readonly StepState[]): void {
  const keys = steps.map((s) => s.key);
  if (keys.length !== stepKeys.length || stepKeys.some((key, i) => keys[i] !== key)) {
    throw new Error(`a study needs exactly the steps ${stepKeys.join(', ')} in that order; got ${keys.join(', ')}`);
  }
}

/**
 * The stale rule, applied when a card's settings are saved. The edited card becomes current when it
 * holds settings only, or stale when it has results to compute again (not run if it never had any).
 * Every card below that had been saved or computed (current, running, failed or already stale) becomes
 * stale, because its inputs changed; a card below that was never run stays not run.
 */
export function applyStepEdit<S extends StepState>(steps: readonly S[], edited: StepKey): S[] {
  requireKnownSteps(steps);
  const at = stepPosition(edited);
  return steps.map((step, i) => {
    if (i < at) return step;
    if (i === at) {
      const status: StepStatus = !isComputedStep(step.key)
        ? 'current'
        : step.status === 'not_run' && step.runId === null
          ? 'not_run'
          : 'stale';
      return { ...step, status };
    }
    return step.status === 'not_run' ? step : { ...step, status: 'stale' as const };
  });
}

/** The cards an edit of `edited` turned stale (to offer running them again). */
export function newlyStaleSteps(before: readonly StepState[], after: readonly StepState[]): StepKey[] {
  return after.filter((step, i) => step.status === 'stale' && before[i]?.status !== 'stale').map((s) => s.key);
}

/**
 * Why a card cannot be run or saved yet, or null when it can: every card above must be current.
 * A card is never blocked by the cards below it.
 */
export function stepBlocker(steps: readonly StepState[], key: StepKey): string | null {
  requireKnownSteps(steps);
  const above = steps.slice(0, stepPosition(key));
  const pending = above.find((step) => step.status !== 'current');
  if (!pending) return null;
  const title = stepLabels[pending.key].title;
  if (pending.status === 'running') return `Wait for "${title}" to finish.`;
  if (pending.status === 'failed') return `"${title}" failed; fix it and run it again first.`;
  if (pending.status === 'stale') {
    return isComputedStep(pending.key)
      ? `"${title}" is stale; run it again first.`
      : `"${title}" is stale; check its settings and save them again first.`;
  }
  return `Complete "${title}" first.`;
}

/**
 * The state of a card after its run ends. Only the run the card is waiting for may change it: a run
 * that a later edit superseded leaves the card as it is.
 */
export function applyRunOutcome<S extends StepState>(
  step: S,
  runId: string,
  outcome: 'succeeded' | 'failed' | 'cancelled',
): S {
  if (step.runId !== runId || step.status !== 'running') return step;
  if (outcome === 'succeeded') return { ...step, status: 'current' };
  if (outcome === 'failed') return { ...step, status: 'failed' };
  return { ...step, status: 'stale' };
}

/** How a member left out of its own group fared against all groups. */
export const memberOutcomes = ['own_group', 'other_group', 'ambiguous', 'unassigned'] as const;
export const memberOutcomeSchema = z.enum(memberOutcomes);
export type MemberOutcome = z.infer<typeof memberOutcomeSchema>;

export const memberOutcomeLabels: Record<MemberOutcome, string> = {
  own_group: 'Returns to its own group',
  other_group: 'Assigned to another group',
  ambiguous: 'Ambiguous',
  unassigned: 'Unassigned',
};

export const CHECK_MEMBERS_PAGE_SIZE = 50;

/** GET /api/labs/:labId/studies/:studyId/check-results — query string. */
export const checkResultsQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  /** Members per page; the card asks for fewer, so a long page of the notebook does not grow longer. */
  pageSize: z.coerce.number().int().min(1).max(200).default(CHECK_MEMBERS_PAGE_SIZE),
  outcome: memberOutcomeSchema.optional(),
  group: z.string().min(1).optional(),
  /** "true": only the members the robust fit flags as outlying. */
  flaggedByRobustFit: z.stringbool().optional(),
});
export type CheckResultsQuery = z.infer<typeof checkResultsQuerySchema>;

/** The Group check card's results: per member, per pair of groups, per variable. */
export const checkResultsSchema = z.object({
  runId: z.uuid(),
  groups: z.array(z.object({ name: z.string(), n: z.number().int(), effectiveN: z.number().int() })),
  variables: z.array(z.string()),
  /** confusion[own group][assigned group, "ambiguous" or "unassigned"] = members. */
  confusion: z.record(z.string(), z.record(z.string(), z.number().int())),
  returnedToOwnGroup: z.number().int(),
  memberCount: z.number().int(),
  kruskalWallis: z.array(z.object({ variable: z.string(), h: z.number(), df: z.number().int(), p: z.number() })),
  /** Per group, the FAST-MCD fit behind the robust flags; empty for runs made before robust flags were kept. */
  robustFit: z
    .array(
      z.object({
        group: z.string(),
        seed: z.number().int(),
        /** χ²_p(0.975); null when the group had no robust fit. */
        cutoff: z.number().nullable(),
        flagged: z.number().int().nullable(),
        /** Why the group has no robust fit (too few members, say); null when it has one. */
        note: z.string().nullable(),
      }),
    )
    .default([]),
  pairs: z.array(
    z.object({
      groupA: z.string(),
      groupB: z.string(),
      t2: z.number(),
      f: z.number(),
      df1: z.number().int(),
      df2: z.number().int(),
      p: z.number(),
    }),
  ),
  members: z.object({
    total: z.number().int(),
    page: z.number().int(),
    pageSize: z.number().int(),
    rows: z.array(
      z.object({
        sampleId: z.string(),
        group: z.string(),
        d2: z.number(),
        d2LeaveOneOut: z.number(),
        pChi2LeaveOneOut: z.number(),
        pHotellingLeaveOneOut: z.number(),
        outcome: memberOutcomeSchema,
        bestGroup: z.string(),
        /** Robust D² against the group's FAST-MCD fit; null when the group has no robust fit. */
        robustD2: z.number().nullable().default(null),
        /** Robust D² above χ²_p(0.975). */
        flaggedByRobustFit: z.boolean().nullable().default(null),
      }),
    ),
  }),
});
export type CheckResults = z.infer<typeof checkResultsSchema>;
