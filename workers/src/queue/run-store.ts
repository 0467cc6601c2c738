import type { AssignmentParameters, ProjectionMethod, RunEvent, RunKind, StoredProjection } from '@provenote/shared';

/** A run as a processor needs it: what to compute and with which parameters. */
export interface ClaimedRun {
  readonly id: string;
  readonly labId: string;
  readonly kind: RunKind;
  readonly parameters: AssignmentParameters;
  readonly seed: number | null;
  readonly attempt: number;
}

export type SampleRole = 'reference' | 'unknown';

/** One role's part of a run's input snapshot, in input order; values in the order of the elements. */
export interface StoredSamples {
  readonly sampleIds: string[];
  readonly groups: (string | null)[];
  readonly values: number[][];
  /** Per sample, per element: true where the value is a detection limit, not a measurement. */
  readonly belowDetection: (boolean[] | null)[];
}

export interface FittedGroupRow {
  readonly name: string;
  readonly n: number;
  readonly effectiveN: number;
}

/** Classification results, one entry per unknown in input order; per-group arrays in `groups` order. */
export interface ClassifyResults {
  readonly groups: FittedGroupRow[];
  /** Names of the coordinates distances were computed in (e.g. "ln(Cu)"). */
  readonly variables: string[];
  readonly sampleIds: string[];
  readonly verdicts: string[];
  readonly bestGroups: string[];
  readonly probabilities: Float64Array;
  readonly runnerUps: (string | null)[];
  readonly runnerUpProbabilities: (number | null)[];
  /** N × G, sample-major. */
  readonly d2: Float64Array;
  readonly pChi2: Float64Array;
  readonly pHotelling: Float64Array;
  /** N × p, sample-major: contributions to D² to the best group. */
  readonly contributions: Float64Array;
  /** The reference samples and unknowns on principal components and canonical variates, with group ellipses. */
  readonly projections: Record<ProjectionMethod, StoredProjection>;
}

/** Leave-one-out results for the members of every reference group, and the separation of the groups. */
export interface GroupCheckResults {
  readonly groups: FittedGroupRow[];
  readonly variables: string[];
  readonly members: {
    /** Position of each member in the reference input. */
    readonly ordinals: Int32Array;
    readonly sampleIds: string[];
    readonly groups: string[];
    readonly d2: Float64Array;
    readonly d2LeaveOneOut: Float64Array;
    readonly pChi2LeaveOneOut: Float64Array;
    readonly pHotellingLeaveOneOut: Float64Array;
    /** own_group, other_group, ambiguous or unassigned. */
    readonly outcomes: string[];
    /** The best group of the left-out member's verdict. */
    readonly bestGroups: string[];
    /** Robust D² against the group's FAST-MCD fit, null where the group was too small for one. */
    readonly robustD2: (number | null)[];
    /** Robust D² above χ²_p(0.975); null where the group has no robust fit. */
    readonly robustFlagged: (boolean | null)[];
  };
  readonly pairs: { groupA: string; groupB: string; t2: number; f: number; df1: number; df2: number; p: number }[];
  /** Small per-run tables kept as JSON: the confusion counts and the Kruskal–Wallis screening. */
  readonly summary: Record<string, unknown>;
}

/**
 * Where runs live (PostgreSQL in the product). Every method that changes a run returns its new state,
 * to be published, or null when the run is no longer in a state the change applies to (cancelled, say).
 */
export interface RunStore {
  /** Marks a queued or interrupted run as running (attempt + 1); null when it was cancelled or finished. */
  claim(runId: string): Promise<ClaimedRun | null>;
  loadSamples(runId: string, role: SampleRole): Promise<StoredSamples>;
  saveProgress(runId: string, progress: number, phase: string): Promise<RunEvent | null>;
  /** Writes all results and marks the run succeeded in one transaction, replacing earlier partial rows. */
  saveClassifyResults(runId: string, results: ClassifyResults): Promise<RunEvent | null>;
  saveGroupCheckResults(runId: string, results: GroupCheckResults): Promise<RunEvent | null>;
  /** Back to queued after a failed attempt that will be retried, keeping the reason. */
  requeue(runId: string, reason: string): Promise<RunEvent | null>;
  markFailed(runId: string, reason: string): Promise<RunEvent | null>;
  markCancelled(runId: string): Promise<RunEvent | null>;
}
