import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { renderRoutes } from '../../../test-utils/render';
import { OpenBundlePage } from './OpenBundlePage';

const labId = '11111111-1111-4111-8111-111111111111';
const studyId = '33333333-3333-4333-8333-333333333333';

const json = (body: unknown, status: number) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

const choose = async () => {
  renderRoutes([{ path: '/labs/:labId/bundles/open', element: <OpenBundlePage /> }], `/labs/${labId}/bundles/open`);
  const input = document.querySelector('input[type="file"]') as HTMLInputElement;
  await userEvent.upload(input, new File([new Uint8Array([80, 75, 3, 4])], 'bundle.zip', { type: 'application/zip' }));
  await userEvent.click(screen.getByRole('button', { name: 'Verify and open' }));
};

describe('OpenBundlePage', () => {
  it('names each problem of a bundle that does not verify', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        json(
          {
            message: 'The bundle does not verify (2 problems); nothing was restored',
            errors: [
              { path: 'results/distances.csv', message: 'checksum: changed: SHA-256 …' },
              { path: '../DME.txt', message: 'unsafe-path: refused' },
            ],
          },
          422,
        ),
      ),
    );
    await choose();
    expect(await screen.findByText('This bundle does not verify; nothing was restored')).toBeInTheDocument();
    expect(screen.getByText('results/distances.csv')).toBeInTheDocument();
    expect(screen.getByText('unsafe-path: refused')).toBeInTheDocument();
  });

  it('links to the restored read-only study after a bundle verified', async () => {
    const fetch = vi.fn(async () =>
      json(
        {
          verification: { ok: true, filesChecked: 14, valuesCompared: 480, problems: [] },
          studyId,
          studyName: 'Synthetic sources (restored bundle)',
          bundle: {
            id: '44444444-4444-4444-8444-444444444444',
            studyId,
            origin: 'uploaded',
            runId: null,
            status: 'succeeded',
            error: null,
            filename: 'bundle.zip',
            sizeBytes: 4,
            sha256: 'ab'.repeat(32),
            createdBy: 'Test analyst',
            createdAt: '2026-01-15T10:30:00.000Z',
          },
        },
        201,
      ),
    );
    vi.stubGlobal('fetch', fetch);
    await choose();
    const link = await screen.findByRole('link', { name: /Synthetic sources \(restored bundle\)/ });
    expect(link).toHaveAttribute('href', `/labs/${labId}/studies/${studyId}`);
    expect(screen.getByText(/14 files matched their checksums and 480 recomputed values/)).toBeInTheDocument();
    expect(fetch).toHaveBeenCalledWith(`/api/labs/${labId}/bundles/open`, expect.objectContaining({ method: 'POST' }));
  });
});
