import { z } from 'zod';
import { assignmentVerdictSchema } from './runs';

/** pca: principal components of the reference samples; cv: canonical variates of the reference groups. */
export const projectionMethods = ['pca', 'cv'] as const;
export const projectionMethodSchema = z.enum(projectionMethods);
export type ProjectionMethod = z.infer<typeof projectionMethodSchema>;

/** The coverages whose ellipse outlines the worker stores; the web offers exactly these. */
export const PROJECTION_LEVELS = [0.9, 0.95, 0.99] as const;
export type ProjectionLevel = (typeof PROJECTION_LEVELS)[number];

/** Unknowns kept per projection, in input order: enough to see the cloud, small enough for one response. */
export const PROJECTION_UNKNOWNS_LIMIT = 5_000;

/** GET /api/labs/:labId/runs/:runId/projection — query string. */
export const projectionQuerySchema = z.object({
  method: projectionMethodSchema.default('pca'),
  level: z.coerce
    .number()
    .refine((level) => (PROJECTION_LEVELS as readonly number[]).includes(level), {
      message: `level must be one of ${PROJECTION_LEVELS.join(', ')}`,
    })
    .default(0.95),
});
export type ProjectionQuery = z.infer<typeof projectionQuerySchema>;

const outlineSchema = z.object({ x: z.array(z.number()), y: z.array(z.number()) });
export type EllipseOutline = z.infer<typeof outlineSchema>;

export const projectionAxisSchema = z.object({
  label: z.string(),
  /** Share of the total variance (pca) or of the trace of W⁻¹B (cv) the axis carries. */
  share: z.number().min(0).max(1),
});

const pointSchema = z.object({ sampleId: z.string(), x: z.number(), y: z.number() });

/** The response: one method's two axes, the scores, and one ellipse per group at the chosen level. */
export const projectionSchema = z.object({
  runId: z.uuid(),
  method: projectionMethodSchema,
  level: z.number(),
  /** Why this method could not be computed for the run (e.g. canonical variates of two groups); then no points. */
  unavailable: z.string().nullable(),
  /** pca only: covariance or correlation matrix of the transformed reference values. */
  basis: z.enum(['covariance', 'correlation']).nullable(),
  /** chi2: χ²₂ quantile; f: the new-observation F region of a group of n, wider for small groups. */
  ellipseBasis: z.enum(['chi2', 'f']),
  axes: z.array(projectionAxisSchema),
  reference: z.array(pointSchema.extend({ group: z.string() })),
  unknowns: z.array(pointSchema.extend({ verdict: assignmentVerdictSchema, group: z.string() })),
  unknownTotal: z.number().int(),
  groups: z.array(
    z.object({
      name: z.string(),
      n: z.number().int(),
      mean: z.tuple([z.number(), z.number()]),
      ellipse: outlineSchema.nullable(),
      /** Why the group has no ellipse (too few members for the F region, a degenerate projection). */
      ellipseNote: z.string().nullable(),
    }),
  ),
});
export type Projection = z.infer<typeof projectionSchema>;

/** What the worker stores per run and method (jsonb); the api picks one level from it. */
export interface StoredProjection {
  readonly unavailable: string | null;
  readonly basis: 'covariance' | 'correlation' | null;
  readonly ellipseBasis: 'chi2' | 'f';
  readonly axes: { label: string; share: number }[];
  readonly reference: { sampleId: string; group: string; x: number; y: number }[];
  readonly unknowns: {
    sampleId: string;
    verdict: z.infer<typeof assignmentVerdictSchema>;
    group: string;
    x: number;
    y: number;
  }[];
  readonly unknownTotal: number;
  readonly groups: {
    name: string;
    n: number;
    effectiveN: number;
    mean: [number, number];
    covariance: [[number, number], [number, number]];
    /** Keyed by the level as text ("0.95"); null with `ellipseNote` when it cannot be drawn. */
    ellipses: Record<string, EllipseOutline> | null;
    ellipseNote: string | null;
  }[];
}
