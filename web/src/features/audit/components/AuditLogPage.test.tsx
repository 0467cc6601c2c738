import { screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { renderRoutes } from '../../../test-utils/render';
import { AuditLogPage } from './AuditLogPage';

const LAB = '11111111-1111-4111-8111-111111111111';
const requested: string[] = [];

function answer(role: string) {
  const me = {
    user: { id: '99999999-9999-4999-8999-999999999999', email: 'a@example.org', displayName: 'Ada' },
    memberships: [{ labId: LAB, labName: 'Synthetic lab', role }],
  };
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://localhost').pathname;
      requested.push(path);
      if (path === '/api/me') return Response.json(me);
      if (path === `/api/labs/${LAB}/audit`) return Response.json({ events: [], nextBefore: null });
      return Response.json({ message: 'Forbidden' }, { status: 403 });
    }),
  );
}

const routes = [{ path: '/labs/:labId/audit', element: <AuditLogPage /> }];

describe('AuditLogPage', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    requested.length = 0;
  });

  it('tells an analyst that only the PI can see it and where to go, without asking the API', async () => {
    answer('analyst');
    renderRoutes(routes, `/labs/${LAB}/audit`);
    expect(await screen.findByText(/Only the lab's principal investigator/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to Members' })).toHaveAttribute('href', `/labs/${LAB}/members`);
    expect(requested).not.toContain(`/api/labs/${LAB}/audit`);
  });

  it('shows the log to the PI', async () => {
    answer('pi');
    renderRoutes(routes, `/labs/${LAB}/audit`);
    expect(await screen.findByText('Nothing has been recorded yet.')).toBeInTheDocument();
    expect(screen.queryByText(/Only the lab's principal investigator/)).not.toBeInTheDocument();
  });
});
