import type { BundleSummary, Step, Study } from '@provenote/shared/schemas';
import { useBundles } from './api/bundles';

/**
 * The Export card's status read from its bundles: the API keeps no run on the export step itself, so
 * without this the card would read "not run" beside a built bundle. The newest bundle decides; a stale
 * step stays stale, since the results changed after that bundle was made.
 */
export function exportStepFromBundles(step: Step, bundles: readonly BundleSummary[]): Step {
  if (step.status === 'stale' || bundles.length === 0) return step;
  const newest = bundles.reduce((a, b) => (Date.parse(b.createdAt) > Date.parse(a.createdAt) ? b : a));
  switch (newest.status) {
    case 'succeeded':
      return { ...step, status: 'current', error: null };
    case 'failed':
      return { ...step, status: 'failed', error: newest.error ?? 'The last bundle failed without a recorded reason.' };
    case 'cancelled':
      return { ...step, status: 'failed', error: 'The last bundle build was cancelled.' };
    case 'queued':
    case 'running':
      // The export card follows the build's progress itself, from the bundle's own run.
      return { ...step, status: 'running', runId: null };
  }
}

/** The study's export step as the notebook shows it; the bundle list is the Export card's own query. */
export function useExportStep(labId: string, study: Study): Step | undefined {
  const bundles = useBundles(labId, study.id);
  const step = study.steps.find((s) => s.key === 'export');
  return step && exportStepFromBundles(step, bundles.data?.bundles ?? []);
}
