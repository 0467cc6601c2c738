import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { renderRoutes } from '../../../test-utils/render';
import {
  assignmentsPage,
  checkResults,
  elementSummary,
  groupSizes,
  LAB,
  REFERENCE_VERSION,
  referenceDataset,
  STUDY,
  study,
} from '../test/notebook-fixtures';
import { fakeApi } from '../test/fake-api';
import { NotebookPage } from './NotebookPage';

const routes = [{ path: '/labs/:labId/studies/:studyId', element: <NotebookPage /> }];
const base = `/api/labs/${LAB}`;
const me = (role: string) => ({
  user: { id: '99999999-9999-4999-8999-999999999999', email: 'a@example.org', displayName: 'Ada Analyst' },
  memberships: [{ labId: LAB, labName: 'Synthetic lab', role }],
});
const current = study(['current', 'current', 'current', 'current', 'current', 'current', 'not_run']);

function answers(
  role = 'analyst',
  overrides: Record<string, (body: unknown) => { status?: number; body: unknown }> = {},
) {
  return fakeApi({
    'GET /api/me': () => ({ body: me(role) }),
    'GET /api/auth/csrf': () => ({ body: { csrfToken: 'test-token' } }),
    [`GET ${base}/studies/${STUDY}`]: () => ({ body: current }),
    [`GET ${base}/datasets`]: () => ({ body: [referenceDataset] }),
    [`GET ${base}/groups`]: () => ({ body: { groups: [] } }),
    [`GET ${base}/studies/${STUDY}/group-sizes`]: () => ({ body: groupSizes }),
    [`GET ${base}/studies/${STUDY}/element-summary`]: () => ({ body: elementSummary }),
    [`GET ${base}/studies/${STUDY}/check-results`]: () => ({ body: checkResults }),
    [`GET ${base}/studies/${STUDY}/overrides`]: () => ({ body: { overrides: [] } }),
    [`GET ${base}/runs/${current.steps[4].runId}/assignments`]: () => ({ body: assignmentsPage }),
    [`GET ${base}/studies/${STUDY}/bundles`]: () => ({ body: { bundles: [] } }),
    ...overrides,
  });
}

const card = (name: RegExp) => screen.getByRole('region', { name });

// The whole notebook renders seven cards with tables in jsdom; under a loaded machine that takes seconds.
vi.setConfig({ testTimeout: 20_000 });

describe('NotebookPage', () => {
  const setupMatchMedia = window.matchMedia;
  // mantine-datatable renders a cell only when its media query matches, and asks with an empty query for
  // "always"; the shared jsdom stub answers every query with false, so the empty one is answered here.
  beforeEach(() => {
    window.matchMedia = (query: string) => ({ ...setupMatchMedia(query), matches: query === '' });
  });
  afterEach(() => {
    window.matchMedia = setupMatchMedia;
    vi.unstubAllGlobals();
  });

  it('shows the cards top to bottom with their status, results and cautions', async () => {
    answers();
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    expect(await screen.findByRole('heading', { name: 'Synthetic reservoir core' })).toBeInTheDocument();
    const titles = screen.getAllByRole('heading', { level: 3 }).map((h) => h.textContent);
    expect(titles).toEqual([
      '1. Data',
      '2. Prepare',
      '3. Reference groups',
      '4. Group check',
      '5. Assign',
      '6. Review',
      '7. Export',
    ]);
    expect(within(card(/Export/)).getByText('Not run')).toBeInTheDocument();

    expect(await within(card(/Prepare/)).findByRole('table', { name: 'Summary per element' })).toBeInTheDocument();
    expect(within(card(/Prepare/)).getByText('75 %')).toBeInTheDocument();
    expect(await within(card(/Reference groups/)).findByText('12.3 %')).toBeInTheDocument();
    expect(within(card(/Reference groups/)).getByText(/true members look like outsiders/)).toBeInTheDocument();
    expect(
      await within(card(/Group check/)).findByText('7 of 8 members return to their own group when left out of it.'),
    ).toBeInTheDocument();
    expect(await within(card(/Assign/)).findByText('U7')).toBeInTheDocument();
    // The caution's own title: the card's method help quotes the same caution in its body.
    expect(within(card(/Assign/)).getByText('Evidence, not proof')).toBeInTheDocument();
    expect(await within(card(/Assign/)).findByText(/North ridge has few members for 1 variables/)).toBeInTheDocument();
    await userEvent.click(within(card(/Assign/)).getByRole('button', { name: 'Details of U7' }));
    expect(await screen.findByRole('table', { name: 'Contributions to D² per element' })).toBeInTheDocument();
  });

  it('saves a card, marks the cards below stale and says which', async () => {
    const stale = study(['current', 'current', 'stale', 'stale', 'stale', 'stale', 'not_run'], {
      status: 'needs_rerun',
    });
    const { calls } = answers('analyst', {
      [`PUT ${base}/studies/${STUDY}/steps/prepare`]: () => ({
        body: { study: stale, staleSteps: ['groups', 'check', 'assign', 'review'] },
      }),
    });
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    await userEvent.click(
      await within(await screen.findByRole('region', { name: /Prepare/ })).findByRole('button', {
        name: 'Save preparation',
      }),
    );

    expect(await screen.findByText(/Now stale: Reference groups, Group check, Assign, Review/)).toBeInTheDocument();
    expect(calls.find((c) => c.key.startsWith('PUT'))?.body).toEqual({ parameters: current.steps[1].parameters });
    expect(within(card(/Group check/)).getByText('Stale')).toBeInTheDocument();
    // The check cannot run again before the groups above it are confirmed.
    expect(within(card(/Group check/)).queryByRole('button', { name: 'Run again' })).not.toBeInTheDocument();
    expect(
      within(card(/Group check/)).getByText(
        '"Reference groups" is stale; check its settings and save them again first.',
      ),
    ).toBeInTheDocument();
    expect(within(card(/Reference groups/)).getByRole('button', { name: 'Keep these settings' })).toBeInTheDocument();
  });

  it('shows the field to fix when the API refuses the settings', async () => {
    answers('analyst', {
      [`PUT ${base}/studies/${STUDY}/steps/prepare`]: () => ({
        status: 400,
        body: {
          message: 'These "Prepare" settings are not valid',
          errors: [{ path: 'parameters.elements', message: 'Choose at least two elements' }],
        },
      }),
    });
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    await userEvent.click(
      await within(await screen.findByRole('region', { name: /Prepare/ })).findByRole('button', {
        name: 'Save preparation',
      }),
    );
    expect(await screen.findByText('Choose at least two elements')).toBeInTheDocument();
  });

  it('lets a student run the group check once every chosen group is approved, but not exclude members', async () => {
    const VERSION = '77777777-7777-4777-8777-777777777777';
    const withGroup = {
      ...current,
      steps: current.steps.map((s) => (s.key === 'groups' ? { ...s, parameters: { groupVersionIds: [VERSION] } } : s)),
    };
    const version = (approvedAt: string | null) => ({
      groups: [
        {
          id: '88888888-8888-4888-8888-888888888888',
          labId: LAB,
          name: 'North ridge',
          description: '',
          createdAt: current.createdAt,
          versions: [
            {
              id: VERSION,
              groupId: '88888888-8888-4888-8888-888888888888',
              number: 1,
              datasetVersionId: REFERENCE_VERSION,
              source: 'column',
              memberIds: ['N1', 'N2'],
              note: '',
              createdAt: current.createdAt,
              createdBy: 'Ada Analyst',
              approvedAt,
              approvedBy: approvedAt && 'Pat PI',
            },
          ],
        },
      ],
    });
    const run = (approvedAt: string | null) =>
      answers('student', {
        [`GET ${base}/studies/${STUDY}`]: () => ({ body: withGroup }),
        [`GET ${base}/groups`]: () => ({ body: version(approvedAt) }),
      });

    run(null);
    const first = renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    await screen.findByRole('heading', { name: 'Synthetic reservoir core' });
    expect(await within(card(/Group check/)).findByText(/once an analyst or PI has approved/)).toBeInTheDocument();
    expect(within(card(/Group check/)).getByRole('button', { name: 'Run group check again' })).toBeDisabled();
    first.unmount();

    run(current.createdAt);
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    await screen.findByRole('heading', { name: 'Synthetic reservoir core' });
    expect(await within(card(/Group check/)).findByText(/analysts and PIs exclude members/)).toBeInTheDocument();
    expect(within(card(/Group check/)).getByRole('button', { name: 'Run group check again' })).toBeEnabled();
    expect(within(card(/Group check/)).queryByRole('button', { name: 'Exclude member' })).not.toBeInTheDocument();
  });

  it('reads the Export card as current once a bundle is built, its origin in full', async () => {
    answers('pi', {
      [`GET ${base}/studies/${STUDY}/bundles`]: () => ({
        body: {
          bundles: [
            {
              id: '44444444-4444-4444-8444-444444444444',
              studyId: STUDY,
              origin: 'built',
              runId: null,
              status: 'succeeded',
              error: null,
              filename: 'provenote-bundle-synthetic-reservoir-core-2026-01-15.zip',
              sizeBytes: 20480,
              sha256: 'ab'.repeat(32),
              createdBy: 'Test PI',
              createdAt: '2026-01-15T10:30:00.000Z',
            },
          ],
        },
      }),
    });
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    const exportCard = await screen.findByRole('region', { name: /Export/ });
    expect(await within(exportCard).findByText('Current')).toBeInTheDocument();
    expect(within(exportCard).queryByText('Not run')).not.toBeInTheDocument();
    const origin = within(exportCard).getByText('built here');
    // Mantine clips a badge's label with an ellipsis; the origin must not be cut off in a narrow column.
    expect(origin).toHaveStyle({ overflow: 'visible' });
    expect(origin.closest('.mantine-Badge-root')).toHaveStyle({ overflow: 'visible' });
  });

  it('offers guests no changes and a signed-off study none to anyone', async () => {
    answers('guest');
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    await screen.findByRole('heading', { name: 'Synthetic reservoir core' });
    expect(screen.queryByRole('button', { name: 'Save preparation' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Copy with new data' })).not.toBeInTheDocument();
  });

  it('locks every card of a signed-off study', async () => {
    const signed = study(['current', 'current', 'current', 'current', 'current', 'current', 'not_run'], {
      status: 'signed_off',
      signedOffAt: '2025-05-02T10:00:00.000Z',
      signedOffBy: 'Pat PI',
    });
    answers('pi', { [`GET ${base}/studies/${STUDY}`]: () => ({ body: signed }) });
    renderRoutes(routes, `/labs/${LAB}/studies/${STUDY}`);
    expect(await screen.findByText(/Signed off by Pat PI/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save preparation' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Sign off/ })).not.toBeInTheDocument();
  });
});
