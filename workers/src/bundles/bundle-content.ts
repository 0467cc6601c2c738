import type { AssignmentParameters, AssignmentVerdict, BundleSignOff } from '@provenote/shared';

/*
 * Everything a bundle records, gathered by the caller (the bundle job from PostgreSQL, a test from a
 * computed run). The writer does no statistics: it lays these out, checksums them and renders the report.
 */

export type SampleRole = 'reference' | 'unknown';

/** One value of one sample, tidy: after normalisation and imputation (ppm) and after the transform. */
export interface PreparedValue {
  readonly sampleId: string;
  readonly role: SampleRole;
  /** The reference group of a reference sample; null for unknowns. */
  readonly group: string | null;
  readonly element: string;
  readonly valuePpm: number;
  /**
   * This element's coordinate after the transform; null where the transform has none (the alr
   * denominator, the last part of the pivot coordinates).
   */
  readonly transformedValue: number | null;
  /** measured, or imputed (below the detection limit or zero, replaced by the run's rule). */
  readonly flag: 'measured' | 'imputed';
}

export interface RobustFitDetails {
  readonly seed: number;
  readonly h: number;
  readonly consistencyFactor: number;
  /** χ²_p(0.975), the reweighting cut-off. */
  readonly cutoff: number;
  /** Per member (order of `members`): robust D² and whether the reweighted estimate kept it. */
  readonly distances: readonly number[];
  readonly support: readonly boolean[];
}

export interface GroupContent {
  readonly name: string;
  /** The reference group's version used by the run. */
  readonly version: number;
  readonly n: number;
  /** Members the estimate rests on: n, or the reweighted MCD support. */
  readonly effectiveN: number;
  readonly method: 'classic' | 'mcd';
  readonly members: readonly string[];
  /** Names of the coordinates the distances are computed in. */
  readonly variables: readonly string[];
  readonly mean: readonly number[];
  readonly covariance: readonly (readonly number[])[];
  readonly robust?: RobustFitDetails;
}

export interface DistanceRow {
  readonly sampleId: string;
  readonly group: string;
  readonly d2: number;
  readonly pChi2: number;
  readonly pHotelling: number;
}

export interface AssignmentRow {
  readonly sampleId: string;
  readonly verdict: AssignmentVerdict;
  readonly group: string;
  readonly probability: number;
  readonly runnerUp: string | null;
  readonly runnerUpProbability: number | null;
  /** The reviewed verdict; equal to the computed one unless a person overrode it (and said why). */
  readonly finalVerdict: AssignmentVerdict;
  readonly finalGroup: string | null;
  readonly overrideReason: string | null;
  /** Who overrode the computed verdict and when (ISO time); null when nobody did. */
  readonly overriddenBy: string | null;
  readonly overriddenAt: string | null;
}

/** One unknown's share of D² to its best group from one distance coordinate; the shares sum to D². */
export interface ContributionRow {
  readonly sampleId: string;
  readonly group: string;
  readonly variable: string;
  readonly contribution: number;
}

export interface MemberRow {
  readonly sampleId: string;
  readonly group: string;
  readonly d2: number;
  readonly d2Loo: number;
  readonly pHotellingLoo: number;
  readonly verdictLoo: string;
}

export interface SeparationRow {
  readonly groupA: string;
  readonly groupB: string;
  readonly t2: number;
  readonly f: number;
  readonly df1: number;
  readonly df2: number;
  readonly p: number;
}

export interface BundleResults {
  readonly distances: readonly DistanceRow[];
  readonly assignments: readonly AssignmentRow[];
  readonly contributions: readonly ContributionRow[];
  readonly members: readonly MemberRow[];
  readonly separation: readonly SeparationRow[];
}

/** A 2-D view of the samples (principal components or canonical variates) with each group's ellipse. */
export interface ProjectionContent {
  readonly title: string;
  /** Why the run has no such view (e.g. canonical variates of two groups); then no points or ellipses. */
  readonly unavailable: string | null;
  readonly xLabel: string;
  readonly yLabel: string;
  readonly points: readonly { sampleId: string; role: SampleRole; group: string | null; x: number; y: number }[];
  readonly ellipses: readonly { group: string; level: number; x: readonly number[]; y: readonly number[] }[];
  /** What the reader must know to read the figure: the ellipses' law, groups without one, unknowns left out. */
  readonly notes: readonly string[];
}

export interface BundleContent {
  readonly provenoteVersion: string;
  readonly engineVersion: string;
  readonly createdAt: string;
  readonly createdBy: { readonly id: string | null; readonly name: string };
  readonly lab: { readonly id: string | null; readonly name: string };
  readonly study: { readonly id: string | null; readonly title: string; readonly description: string };
  readonly runId: string | null;
  /** The PI's sign-off of the study; null only for bundles built outside a signed-off study (tests, the CLI). */
  readonly signOff: BundleSignOff | null;
  readonly parameters: AssignmentParameters;
  readonly seed: number;
  /** The uploaded files, byte for byte. */
  readonly inputs: readonly { readonly name: string; readonly bytes: Uint8Array }[];
  readonly prepared: readonly PreparedValue[];
  readonly groups: readonly GroupContent[];
  readonly results: BundleResults;
  /** Principal components, then canonical variates, as the assign run stored them; none, no figures. */
  readonly projections?: readonly ProjectionContent[];
}
