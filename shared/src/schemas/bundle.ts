import { z } from 'zod';
import { assignmentParametersSchema } from './runs';

/** Identifies a Provenote result bundle; raised only when the layout changes incompatibly. */
export const BUNDLE_FORMAT = 'provenote-result-bundle';
export const BUNDLE_FORMAT_VERSION = 1;

const sha256Schema = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 is 64 lower-case hexadecimal digits');

/** A path inside the bundle: relative, forward slashes, no "." or ".." segments. */
export const bundlePathSchema = z
  .string()
  .min(1)
  .max(400)
  .refine((path) => !path.startsWith('/') && !path.includes('\\') && !/^[A-Za-z]:/.test(path), {
    message: 'bundle paths are relative, with forward slashes',
  })
  .refine((path) => path.split('/').every((segment) => segment !== '' && segment !== '.' && segment !== '..'), {
    message: 'bundle paths have no empty, "." or ".." segments',
  });

export const bundleFileSchema = z.object({
  path: bundlePathSchema,
  bytes: z.number().int().min(0),
  sha256: sha256Schema,
});
export type BundleFile = z.infer<typeof bundleFileSchema>;

export const bundleGroupSchema = z.object({
  name: z.string().min(1),
  /** The reference group's version at the time of the run, so a later edit of the group is visible. */
  version: z.number().int().min(1),
  /** Folder under groups/ holding this group's files (group names may hold characters unfit for paths). */
  directory: bundlePathSchema,
  n: z.number().int().min(1),
  effectiveN: z.number().int().min(1),
  covariance: z.enum(['classic', 'mcd']),
});
export type BundleGroup = z.infer<typeof bundleGroupSchema>;

const actorSchema = z.object({ id: z.string().nullable(), name: z.string().min(1) });

/** The PI's sign-off the bundle was made under; absent in bundles made before it was recorded. */
export const bundleSignOffSchema = z.object({
  by: actorSchema,
  at: z.iso.datetime({ offset: true }),
  statement: z.string(),
});
export type BundleSignOff = z.infer<typeof bundleSignOffSchema>;

/** manifest.json: who made the bundle, from what, with which settings, and the checksum of every other file. */
export const bundleManifestSchema = z.object({
  format: z.literal(BUNDLE_FORMAT),
  formatVersion: z.literal(BUNDLE_FORMAT_VERSION),
  provenoteVersion: z.string().min(1),
  engineVersion: z.string().min(1),
  createdAt: z.iso.datetime({ offset: true }),
  createdBy: actorSchema,
  lab: actorSchema,
  study: z.object({ id: z.string().nullable(), title: z.string().min(1), description: z.string() }),
  runId: z.string().nullable(),
  signOff: bundleSignOffSchema.optional(),
  parameters: assignmentParametersSchema,
  /** Seed of every random step (the FAST-MCD subsets); recorded even when the run used none. */
  seed: z.number().int().min(0),
  groups: z.array(bundleGroupSchema).min(1),
  files: z.array(bundleFileSchema).min(1),
});
export type BundleManifest = z.infer<typeof bundleManifestSchema>;
