import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { renderRoutes } from '../../../test-utils/render';
import { fakeApi } from '../../notebook/test/fake-api';
import { LAB, northRidge, referenceDataset } from '../../notebook/test/notebook-fixtures';
import { GroupsPage } from './GroupsPage';

const base = `/api/labs/${LAB}`;
const routes = [{ path: '/labs/:labId/groups', element: <GroupsPage /> }];
const group = northRidge;

function answers(role: string) {
  let approved = false;
  return fakeApi({
    'GET /api/me': () => ({
      body: {
        user: { id: '99999999-9999-4999-8999-999999999999', email: 'a@example.org', displayName: 'Ada Analyst' },
        memberships: [{ labId: LAB, labName: 'Synthetic lab', role }],
      },
    }),
    'GET /api/auth/csrf': () => ({ body: { csrfToken: 'test-token' } }),
    [`GET ${base}/groups`]: () => ({ body: { groups: [group(approved)] } }),
    [`GET ${base}/datasets`]: () => ({ body: [referenceDataset] }),
    [`POST ${base}/groups/${group(false).id}/versions/${group(false).versions[0].id}/approve`]: () => {
      approved = true;
      return { status: 201, body: group(true) };
    },
  });
}

describe('GroupsPage', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('lets an analyst approve a version so students can use it', async () => {
    const { calls } = answers('analyst');
    renderRoutes(routes, `/labs/${LAB}/groups`);
    const card = await screen.findByRole('region', { name: 'Group North ridge' });
    expect(within(card).getByText(/From the group column/)).toBeInTheDocument();
    await userEvent.click(within(card).getByRole('button', { name: 'Approve v1' }));
    expect(await within(card).findByText('by Ada Analyst')).toBeInTheDocument();
    expect(within(card).getByText('Approved')).toBeInTheDocument();
    expect(calls.filter((c) => c.key.startsWith('POST'))).toHaveLength(1);
    expect(screen.getByRole('button', { name: 'Build groups' })).toBeDisabled();
  });

  it('shows students the approval state without offering changes', async () => {
    answers('student');
    renderRoutes(routes, `/labs/${LAB}/groups`);
    const card = await screen.findByRole('region', { name: 'Group North ridge' });
    expect(within(card).getByText('Not approved')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Build groups' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Approve/ })).not.toBeInTheDocument();
  });
});
