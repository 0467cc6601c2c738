import { bundleManifestSchema, bundlePathSchema, type BundleManifest } from '@provenote/shared';
import { sha256Hex } from './build-bundle';
import { CONTRIBUTIONS_PATH, MANIFEST_PATH } from './bundle-layout';
import { compareWithRecomputation } from './compare-results';
import { MismatchLog } from './mismatch-log';
import { readZipEntries } from './zip-reader';

export type BundleProblemKind =
  'unreadable' | 'unsafe-path' | 'duplicate' | 'manifest' | 'missing' | 'unexpected' | 'checksum' | 'difference';

export interface BundleProblem {
  readonly kind: BundleProblemKind;
  /** The file concerned, as named in the archive; null for the archive as a whole. */
  readonly path: string | null;
  readonly message: string;
}

export interface BundleVerification {
  /** True only when every file is listed, intact and every recomputed value matches. */
  readonly ok: boolean;
  readonly manifest: BundleManifest | null;
  readonly filesChecked: number;
  readonly valuesCompared: number;
  readonly problems: BundleProblem[];
  /** Comparisons left out because the bundle predates a file, each saying which and why. */
  readonly skipped: string[];
}

/*
 * Files added to the bundle after the first bundles were handed on. A manifest that does not list one
 * was written before it existed, so its absence is no tamper sign; a listed one that is missing still is.
 */
const ADDED_LATER = [CONTRIBUTIONS_PATH];

/**
 * Checks a bundle: the archive's file list against the manifest (unsafe names such as ../x or /etc/x
 * refused and named), every file's SHA-256, then the results recomputed from inputs/prepared.csv with
 * the manifest's parameters. The recomputation runs even when a checksum fails, so a changed number is
 * also named by file, line and column.
 */
export async function verifyBundle(zip: Buffer): Promise<BundleVerification> {
  const problems: BundleProblem[] = [];
  const skipped: string[] = [];
  const done = (manifest: BundleManifest | null, filesChecked = 0, valuesCompared = 0): BundleVerification => ({
    ok: problems.length === 0,
    manifest,
    filesChecked,
    valuesCompared,
    problems,
    skipped,
  });
  let entries;
  try {
    entries = await readZipEntries(zip);
  } catch (error) {
    problems.push({ kind: 'unreadable', path: null, message: (error as Error).message });
    return done(null);
  }
  const files = new Map<string, Buffer>();
  for (const entry of entries) {
    if (!bundlePathSchema.safeParse(entry.name).success) {
      problems.push({
        kind: 'unsafe-path',
        path: entry.name,
        message: `refused: "${entry.name}" points outside the bundle or is not a plain relative path`,
      });
    } else if (files.has(entry.name)) {
      problems.push({
        kind: 'duplicate',
        path: entry.name,
        message: `the archive holds "${entry.name}" more than once`,
      });
    } else {
      files.set(entry.name, entry.bytes);
    }
  }
  const manifestBytes = files.get(MANIFEST_PATH);
  if (!manifestBytes) {
    problems.push({ kind: 'missing', path: MANIFEST_PATH, message: 'the bundle has no manifest.json' });
    return done(null);
  }
  let manifest: BundleManifest;
  try {
    const parsed = bundleManifestSchema.safeParse(JSON.parse(manifestBytes.toString('utf8')));
    if (!parsed.success) {
      const issues = parsed.error.issues.map((issue) => `${issue.path.join('.') || '(top)'}: ${issue.message}`);
      problems.push({ kind: 'manifest', path: MANIFEST_PATH, message: `not a valid manifest: ${issues.join('; ')}` });
      return done(null);
    }
    manifest = parsed.data;
  } catch (error) {
    problems.push({ kind: 'manifest', path: MANIFEST_PATH, message: `not valid JSON: ${(error as Error).message}` });
    return done(null);
  }

  const listed = new Set<string>();
  for (const file of manifest.files) {
    listed.add(file.path);
    const bytes = files.get(file.path);
    if (!bytes) {
      problems.push({ kind: 'missing', path: file.path, message: `listed in the manifest but not in the archive` });
    } else if (bytes.byteLength !== file.bytes || sha256Hex(bytes) !== file.sha256) {
      problems.push({
        kind: 'checksum',
        path: file.path,
        message: `changed: SHA-256 ${sha256Hex(bytes)} (${bytes.byteLength} bytes), the manifest records ${file.sha256} (${file.bytes} bytes)`,
      });
    }
  }
  for (const path of files.keys()) {
    if (path !== MANIFEST_PATH && !listed.has(path)) {
      problems.push({ kind: 'unexpected', path, message: 'in the archive but not listed in the manifest' });
    }
  }

  for (const path of ADDED_LATER) {
    if (!listed.has(path) && !files.has(path))
      skipped.push(`${path}: not compared, the manifest does not list it (the bundle predates that file)`);
  }

  const log = new MismatchLog();
  compareWithRecomputation(files, manifest, log);
  for (const mismatch of log.mismatches())
    problems.push({ kind: 'difference', path: mismatch.path, message: mismatch.message });
  return done(manifest, manifest.files.length, log.compared);
}
