import type { BundleSummary, RunStatus } from '@provenote/shared';
import type { BundleEntity } from './bundle.entity';

/** A bundle as listed; an uploaded bundle was complete on arrival, a built one stands where its run stands. */
export function toBundleSummary(bundle: BundleEntity): BundleSummary {
  const status: RunStatus = bundle.origin === 'uploaded' ? 'succeeded' : (bundle.run?.status ?? 'failed');
  return {
    id: bundle.id,
    studyId: bundle.studyId,
    origin: bundle.origin,
    runId: bundle.runId,
    status,
    error: bundle.run?.error ?? null,
    filename: bundle.filename,
    sizeBytes: bundle.sizeBytes,
    sha256: bundle.sha256,
    createdBy: bundle.createdBy?.displayName ?? null,
    createdAt: bundle.createdAt.toISOString(),
  };
}

/** A file name a person recognises: the study's name (letters and digits only) and the day. */
export function bundleFilename(studyName: string, at: Date): string {
  const slug =
    studyName
      .normalize('NFKD')
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60)
      .toLowerCase() || 'study';
  return `provenote-bundle-${slug}-${at.toISOString().slice(0, 10)}.zip`;
}
