import { describe, expect, it } from 'vitest';
import type { BundleSummary, Step } from '@provenote/shared/schemas';
import { exportStepFromBundles } from './export-step';

const step: Step = {
  key: 'export',
  status: 'not_run',
  parameters: null,
  runId: null,
  error: null,
  updatedAt: '2026-01-15T09:00:00.000Z',
  updatedBy: null,
};

const bundle = (status: BundleSummary['status'], createdAt: string, error: string | null = null): BundleSummary => ({
  id: `44444444-4444-4444-8444-${createdAt.slice(11, 13)}4444444444`,
  studyId: '33333333-3333-4333-8333-333333333333',
  origin: 'built',
  runId: null,
  status,
  error,
  filename: 'provenote-bundle-synthetic-2026-01-15.zip',
  sizeBytes: status === 'succeeded' ? 20480 : null,
  sha256: null,
  createdBy: 'Test PI',
  createdAt,
});

describe('exportStepFromBundles', () => {
  it('keeps the step as it is while no bundle was made', () => {
    expect(exportStepFromBundles(step, [])).toBe(step);
  });

  it('reads current once the newest bundle is built, whatever the list order', () => {
    const bundles = [
      bundle('failed', '2026-01-15T10:00:00.000Z', 'disk full'),
      bundle('succeeded', '2026-01-15T11:00:00.000Z'),
    ];
    expect(exportStepFromBundles(step, bundles).status).toBe('current');
    expect(exportStepFromBundles(step, [...bundles].reverse()).status).toBe('current');
  });

  it('reads running while the newest bundle is queued or being built', () => {
    const older = bundle('succeeded', '2026-01-15T10:00:00.000Z');
    expect(exportStepFromBundles(step, [older, bundle('queued', '2026-01-15T11:00:00.000Z')]).status).toBe('running');
    expect(exportStepFromBundles(step, [bundle('running', '2026-01-15T11:00:00.000Z')]).status).toBe('running');
  });

  it('reads failed with the reason when the newest build failed or was cancelled', () => {
    const failed = exportStepFromBundles(step, [bundle('failed', '2026-01-15T11:00:00.000Z', 'disk full')]);
    expect(failed).toMatchObject({ status: 'failed', error: 'disk full' });
    const cancelled = exportStepFromBundles(step, [bundle('cancelled', '2026-01-15T11:00:00.000Z')]);
    expect(cancelled).toMatchObject({ status: 'failed', error: 'The last bundle build was cancelled.' });
  });

  it('leaves a stale step stale: the results changed after the bundle', () => {
    const stale = { ...step, status: 'stale' as const };
    expect(exportStepFromBundles(stale, [bundle('succeeded', '2026-01-15T11:00:00.000Z')]).status).toBe('stale');
  });
});
