import { render as testingLibraryRender, type RenderOptions } from '@testing-library/react';
import type { ReactElement } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { Providers } from '../app/providers';
import { createQueryClient } from '../app/query-client';

/** Renders inside Provenote's providers (Mantine theme, a fresh query client). */
export function render(ui: ReactElement, options?: RenderOptions) {
  const queryClient = createQueryClient();
  return testingLibraryRender(ui, {
    wrapper: ({ children }) => <Providers queryClient={queryClient}>{children}</Providers>,
    ...options,
  });
}

/** Renders the given routes at `path` in a memory router inside the providers. */
export function renderRoutes(routes: RouteObject[], path: string) {
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  return render(<RouterProvider router={router} />);
}
