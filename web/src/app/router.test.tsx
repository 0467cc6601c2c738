import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderRoutes } from '../test-utils/render';
import { routes } from './router';

describe('app shell', () => {
  it('renders the sign-in route', async () => {
    renderRoutes(routes, '/sign-in');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(screen.getByLabelText(/E-mail/)).toBeInTheDocument();
  });

  it('renders the signed-in frame with navigation', async () => {
    renderRoutes(routes, '/');
    expect(await screen.findByRole('navigation', { name: 'Main navigation' })).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Studies' })).toBeInTheDocument();
  });

  it('says so when a page does not exist', async () => {
    renderRoutes(routes, '/no/such/page');
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeInTheDocument();
  });
});
