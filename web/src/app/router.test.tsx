import { screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { renderRoutes } from '../test-utils/render';
import { routes } from './router';

const me = {
  user: { id: '7f1b3c2e-8a4d-4c3b-9a1e-2b5c6d7e8f90', email: 'pi@lab.test', displayName: 'Rosa Pi' },
  memberships: [{ labId: '0b6f1d6e-4c1f-4a63-9d55-5f0d1a2b3c4d', labName: 'Basalt group', role: 'pi' }],
};

/** Answers /api/me with `meStatus`, the demo list with nothing, and fails the test on anything else. */
function fakeApi(meStatus: 200 | 401) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string) => {
      if (input === '/api/me') {
        return new Response(JSON.stringify(meStatus === 200 ? me : { message: 'Please sign in' }), {
          status: meStatus,
        });
      }
      if (input === '/api/auth/demo-accounts') return new Response(JSON.stringify({ accounts: [], password: null }));
      throw new Error(`Unexpected request to ${input}`);
    }),
  );
}

describe('app shell', () => {
  beforeEach(() => fakeApi(200));
  afterEach(() => vi.unstubAllGlobals());

  it('renders the sign-in route', async () => {
    renderRoutes(routes, '/sign-in');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(screen.getByLabelText(/E-mail/)).toBeInTheDocument();
  });

  it('renders the signed-in frame with navigation, the lab switcher and the lab’s pages', async () => {
    renderRoutes(routes, '/');
    expect(await screen.findByRole('navigation', { name: 'Main navigation' })).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Studies' })).toBeInTheDocument();
    expect(screen.getByRole('combobox', { name: 'Lab' })).toHaveValue('Basalt group');
    expect(screen.getByText('Principal investigator')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Members' })).toHaveAttribute(
      'href',
      `/labs/${me.memberships[0].labId}/members`,
    );
    expect(screen.getByRole('link', { name: 'Audit log' })).toBeInTheDocument();
  });

  it('sends a visitor without a session to sign-in, remembering where they were going', async () => {
    fakeApi(401);
    renderRoutes(routes, '/labs/0b6f1d6e-4c1f-4a63-9d55-5f0d1a2b3c4d/members');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
  });

  it('says so when a page does not exist', async () => {
    renderRoutes(routes, '/no/such/page');
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeInTheDocument();
  });
});
