import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Run } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { RunProgress } from './RunProgress';

const labId = '11111111-1111-4111-8111-111111111111';
const runId = '22222222-2222-4222-8222-222222222222';
const run = (overrides: Partial<Run>): Run => ({
  id: runId,
  labId,
  studyId: null,
  kind: 'classify',
  status: 'running',
  progress: 0.4,
  phase: 'classifying unknowns',
  error: null,
  parameters: {},
  seed: null,
  attempt: 1,
  createdBy: null,
  createdAt: '2025-01-01T00:00:00.000Z',
  startedAt: '2025-01-01T00:00:01.000Z',
  finishedAt: null,
  ...overrides,
});

const json = (body: unknown) =>
  new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

describe('RunProgress (polling, as where EventSource is missing)', () => {
  it('follows the run from running to a failure and shows the reason', async () => {
    const answers = [run({}), run({ status: 'failed', progress: 0.4, error: 'group "upland" has n = 3 members' })];
    const fetch = vi.fn(async (_url: string) => json(answers.length > 1 ? answers.shift() : answers[0]));
    vi.stubGlobal('fetch', fetch);
    render(<RunProgress labId={labId} runId={runId} />);
    expect(await screen.findByText('Running · classifying unknowns')).toBeInTheDocument();
    expect(screen.getByText('40 %')).toBeInTheDocument();
    expect(await screen.findByText('group "upland" has n = 3 members', {}, { timeout: 4000 })).toBeInTheDocument();
    expect(fetch.mock.calls[0][0]).toBe(`/api/labs/${labId}/runs/${runId}`);
  });

  it('cancels through the API', async () => {
    const fetch = vi.fn(async (_url: string, init?: RequestInit) =>
      json(init?.method === 'POST' ? run({ status: 'cancelled', phase: 'cancelled' }) : run({})),
    );
    vi.stubGlobal('fetch', fetch);
    document.cookie = 'provenote_csrf=token';
    render(<RunProgress labId={labId} runId={runId} canCancel />);
    await userEvent.click(await screen.findByRole('button', { name: 'Cancel run' }));
    expect(await screen.findByText('Cancelled')).toBeInTheDocument();
    const post = fetch.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(post?.[0]).toBe(`/api/labs/${labId}/runs/${runId}/cancel`);
  });
});
