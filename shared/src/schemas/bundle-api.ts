import { z } from 'zod';
import { runStatusSchema } from './runs';

/** built: made by the bundle job from a signed-off study; uploaded: opened from a file and verified. */
export const bundleOrigins = ['built', 'uploaded'] as const;

/** GET /api/labs/:labId/studies/:studyId/bundles — one entry; the zip itself is downloaded separately. */
export const bundleSummarySchema = z.object({
  id: z.uuid(),
  studyId: z.uuid(),
  origin: z.enum(bundleOrigins),
  /** The bundle job's run (built bundles); follow its progress until it succeeds. */
  runId: z.uuid().nullable(),
  status: runStatusSchema,
  error: z.string().nullable(),
  filename: z.string(),
  sizeBytes: z.number().int().nullable(),
  sha256: z.string().nullable(),
  createdBy: z.string().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type BundleSummary = z.infer<typeof bundleSummarySchema>;

export const bundleListSchema = z.object({ bundles: z.array(bundleSummarySchema) });
export type BundleList = z.infer<typeof bundleListSchema>;

export const bundleProblemSchema = z.object({
  kind: z.enum([
    'unreadable',
    'unsafe-path',
    'duplicate',
    'manifest',
    'missing',
    'unexpected',
    'checksum',
    'difference',
  ]),
  path: z.string().nullable(),
  message: z.string(),
});
export type BundleProblemView = z.infer<typeof bundleProblemSchema>;

/** What an upload's verification found; `problems` is empty exactly when the bundle verified. */
export const bundleVerificationSchema = z.object({
  ok: z.boolean(),
  filesChecked: z.number().int(),
  valuesCompared: z.number().int(),
  problems: z.array(bundleProblemSchema),
});
export type BundleVerificationView = z.infer<typeof bundleVerificationSchema>;

/** POST /api/labs/:labId/bundles/open — 201 with the restored, read-only study. */
export const openedBundleSchema = z.object({
  verification: bundleVerificationSchema,
  studyId: z.uuid(),
  studyName: z.string(),
  bundle: bundleSummarySchema,
});
export type OpenedBundle = z.infer<typeof openedBundleSchema>;

/**
 * The 422 answer to a bundle that does not verify: nothing was stored. Each error names the file
 * ("(archive)" for the zip as a whole) and starts with the problem's kind ("checksum: …").
 */
export const rejectedBundleSchema = z.object({
  message: z.string(),
  errors: z.array(z.object({ path: z.string(), message: z.string() })),
});
export type RejectedBundle = z.infer<typeof rejectedBundleSchema>;
