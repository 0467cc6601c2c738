import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { BundleSummary, Run } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { ExportBundles } from './ExportBundles';

const labId = '11111111-1111-4111-8111-111111111111';
const studyId = '33333333-3333-4333-8333-333333333333';
const runId = '22222222-2222-4222-8222-222222222222';

const bundle = (overrides: Partial<BundleSummary>): BundleSummary => ({
  id: '44444444-4444-4444-8444-444444444444',
  studyId,
  origin: 'built',
  runId,
  status: 'succeeded',
  error: null,
  filename: 'provenote-bundle-synthetic-2026-01-15.zip',
  sizeBytes: 20480,
  sha256: 'ab'.repeat(32),
  createdBy: 'Test PI',
  createdAt: '2026-01-15T10:30:00.000Z',
  ...overrides,
});

const run: Run = {
  id: runId,
  labId,
  studyId,
  kind: 'bundle',
  status: 'running',
  progress: 0.6,
  phase: 'verifying the bundle',
  error: null,
  parameters: {},
  seed: null,
  attempt: 1,
  createdBy: null,
  createdAt: '2026-01-15T10:30:00.000Z',
  startedAt: '2026-01-15T10:30:01.000Z',
  finishedAt: null,
};

const json = (body: unknown, status = 200) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

const show = (props: { signedOff: boolean; isPi: boolean }) =>
  render(
    <MemoryRouter>
      <ExportBundles labId={labId} studyId={studyId} {...props} />
    </MemoryRouter>,
  );

describe('ExportBundles', () => {
  it('lists earlier bundles with download links and lets the PI build one, following its run', async () => {
    let built = false;
    const fetch = vi.fn(async (url: string, init?: RequestInit) => {
      if (url.endsWith('/bundles') && init?.method === 'POST') {
        built = true;
        return json(
          bundle({ id: '55555555-5555-4555-8555-555555555555', status: 'queued', sizeBytes: null, sha256: null }),
          201,
        );
      }
      if (url.endsWith(`/runs/${runId}`)) return json(run);
      const building = bundle({
        id: '55555555-5555-4555-8555-555555555555',
        status: 'running',
        sizeBytes: null,
        sha256: null,
      });
      return json({ bundles: built ? [building, bundle({})] : [bundle({})] });
    });
    vi.stubGlobal('fetch', fetch);
    show({ signedOff: true, isPi: true });

    const link = await screen.findByRole('link', { name: 'provenote-bundle-synthetic-2026-01-15.zip' });
    expect(link).toHaveAttribute('href', `/api/labs/${labId}/bundles/44444444-4444-4444-8444-444444444444/download`);
    expect(
      screen.getByText(/statistical evidence of how typical a sample is of a group, not\s+proof of its origin/),
    ).toBeInTheDocument();

    await userEvent.click(screen.getByRole('button', { name: 'Build a result bundle' }));
    expect(await screen.findByText('Running · verifying the bundle')).toBeInTheDocument();
    const rows = screen.getAllByRole('row');
    expect(within(rows[1]).getByText('Being built…')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Build a result bundle' })).toBeDisabled();
    expect(fetch).toHaveBeenCalledWith(
      `/api/labs/${labId}/studies/${studyId}/bundles`,
      expect.objectContaining({ method: 'POST' }),
    );
  });

  it('says why the button is off: not signed off, or not the PI', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json({ bundles: [] })),
    );
    const { unmount } = show({ signedOff: false, isPi: true });
    expect(await screen.findByText('No bundles of this study yet.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Build a result bundle' })).toBeDisabled();
    expect(screen.getByText(/Sign the study off on the Review card first/)).toBeInTheDocument();
    unmount();
    show({ signedOff: true, isPi: false });
    expect(await screen.findByText("Only the lab's PI can build a bundle.")).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Build a result bundle' })).toBeDisabled();
  });
});
