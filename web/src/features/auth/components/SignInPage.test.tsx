import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { renderRoutes } from '../../../test-utils/render';
import { SignInPage } from './SignInPage';

type Handler = (init: RequestInit | undefined) => { status: number; body?: unknown };

/** A fetch that answers the API paths given and fails the test on any other. */
function fakeApi(handlers: Record<string, Handler>) {
  const calls: { path: string; init?: RequestInit }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string, init?: RequestInit) => {
      const path = input.replace(/^\/api/, '');
      calls.push({ path, init });
      const handler = handlers[path];
      if (!handler) throw new Error(`Unexpected request to ${input}`);
      const { status, body } = handler(init);
      return new Response(body === undefined ? null : JSON.stringify(body), { status });
    }),
  );
  return calls;
}

const noDemo: Handler = () => ({ status: 200, body: { accounts: [], password: null } });
const routes = [
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/labs/:labId/members', element: <h1>Members page</h1> },
  { path: '/', element: <h1>Home</h1> },
];

describe('SignInPage', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    document.cookie = 'provenote_csrf=; expires=Thu, 01 Jan 1970 00:00:00 GMT';
  });

  it('says what to fix before sending anything', async () => {
    const calls = fakeApi({ '/auth/demo-accounts': noDemo });
    renderRoutes(routes, '/sign-in');
    await userEvent.type(screen.getByLabelText(/E-mail/), 'not-an-address');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address like name@example.org')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(calls.map((call) => call.path)).toEqual(['/auth/demo-accounts']);
  });

  it('signs in with the CSRF header and goes to the page asked for', async () => {
    document.cookie = 'provenote_csrf=token-123';
    const calls = fakeApi({
      '/auth/demo-accounts': noDemo,
      '/auth/sign-in': () => ({
        status: 200,
        body: { user: { id: '7f1b3c2e-8a4d-4c3b-9a1e-2b5c6d7e8f90', email: 'a@b.org', displayName: 'A' } },
      }),
    });
    renderRoutes(routes, '/sign-in?next=%2Flabs%2F1%2Fmembers');
    await userEvent.type(screen.getByLabelText(/E-mail/), '  Ana@Example.org ');
    await userEvent.type(screen.getByLabelText(/Password/), 'secret');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'Members page' })).toBeInTheDocument();
    const signIn = calls.find((call) => call.path === '/auth/sign-in');
    expect(JSON.parse(String(signIn?.init?.body))).toEqual({ email: 'ana@example.org', password: 'secret' });
    expect((signIn?.init?.headers as Record<string, string>)['X-CSRF-Token']).toBe('token-123');
  });

  it('shows the API’s message when the sign-in is refused', async () => {
    document.cookie = 'provenote_csrf=token-123';
    fakeApi({
      '/auth/demo-accounts': noDemo,
      '/auth/sign-in': () => ({ status: 401, body: { message: 'The e-mail or the password is not right' } }),
    });
    renderRoutes(routes, '/sign-in');
    await userEvent.type(screen.getByLabelText(/E-mail/), 'ana@example.org');
    await userEvent.type(screen.getByLabelText(/Password/), 'wrong');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('The e-mail or the password is not right');
  });

  it('offers the demo sign-ins only when the API lists them, and fills the form from one', async () => {
    fakeApi({
      '/auth/demo-accounts': () => ({
        status: 200,
        body: { accounts: [{ email: 'pi@demo.test', displayName: 'Demo PI', role: 'pi' }], password: 'demo-pass' },
      }),
    });
    renderRoutes(routes, '/sign-in');
    await userEvent.click(await screen.findByRole('button', { name: /Principal investigator: pi@demo.test/ }));
    await waitFor(() => expect(screen.getByLabelText(/E-mail/)).toHaveValue('pi@demo.test'));
    expect(screen.getByLabelText(/Password/)).toHaveValue('demo-pass');
  });

  it('never follows a next= link to another site', async () => {
    const { safeNext } = await import('./SignInPage');
    expect(safeNext('//evil.example/x')).toBe('/');
    expect(safeNext('https://evil.example')).toBe('/');
    expect(safeNext('/labs/1/audit')).toBe('/labs/1/audit');
  });
});
