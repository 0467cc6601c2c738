import type {
  AssignmentParameters,
  AssignmentVerdict,
  BundleManifest,
  BundleSignOff,
  ProjectionMethod,
  RunEvent,
  StoredProjection,
} from '@provenote/shared';
import type { MemberRow, SeparationRow } from '../bundles/bundle-content';
import type { StoredSamples } from '../queue/run-store';

/** One classified unknown as the assign run stored it; per-group arrays in the order of `groups`. */
export interface StoredAssignment {
  readonly sampleId: string;
  readonly verdict: AssignmentVerdict;
  readonly group: string;
  readonly probability: number;
  readonly runnerUp: string | null;
  readonly runnerUpProbability: number | null;
  readonly d2: readonly number[];
  readonly pChi2: readonly number[];
  readonly pHotelling: readonly number[];
  /** Per distance coordinate (order of `variables`), the contribution to D² to the best group. */
  readonly contributions: readonly number[];
}

/** A reviewer's final verdict for one unknown, with the reason it differs from the computed one. */
export interface StoredOverride {
  readonly sampleId: string;
  readonly verdict: AssignmentVerdict;
  readonly group: string | null;
  readonly reason: string;
  /** Display name of who made the override, and when (ISO time). */
  readonly by: string;
  readonly at: string;
}

/**
 * Everything a bundle job reads for one signed-off study, as stored: the assign run's input snapshot
 * and results, the group check's results, the reviewers' overrides and the raw uploaded files.
 */
export interface BundleSources {
  readonly provenoteVersion: string;
  readonly createdAt: string;
  readonly createdBy: { readonly id: string | null; readonly name: string };
  readonly lab: { readonly id: string; readonly name: string };
  readonly study: { readonly id: string; readonly title: string; readonly description: string };
  /** The assign run whose results the bundle carries. */
  readonly assignRunId: string;
  readonly signOff: BundleSignOff;
  readonly parameters: AssignmentParameters;
  readonly seed: number;
  readonly rawFiles: readonly { readonly name: string; readonly bytes: Uint8Array }[];
  readonly reference: StoredSamples;
  readonly unknowns: StoredSamples;
  /** Version number of each reference group the study used, by group name. */
  readonly groupVersions: ReadonlyMap<string, number>;
  readonly groups: readonly string[];
  /** The coordinates distances were computed in, as the assign run named them. */
  readonly variables: readonly string[];
  readonly assignments: readonly StoredAssignment[];
  readonly overrides: readonly StoredOverride[];
  readonly members: readonly MemberRow[];
  readonly separation: readonly SeparationRow[];
  /** The assign run's stored projections by method; a method it did not store is simply absent. */
  readonly projections: Partial<Record<ProjectionMethod, StoredProjection>>;
}

/** Where the bundle job reads its sources and keeps the zip it built (PostgreSQL in the product). */
export interface BundleSource {
  load(bundleRunId: string): Promise<BundleSources>;
  /** Stores the zip and marks the run succeeded in one transaction; null when the run is no longer running. */
  save(bundleRunId: string, zip: Buffer, manifest: BundleManifest): Promise<RunEvent | null>;
}
