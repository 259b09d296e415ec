import { render, type RenderOptions } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { QueryClient } from '@tanstack/react-query';
import type { ReactElement } from 'react';
import { createMemoryRouter, MemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from '@/app/provider';
import { routes } from '@/app/router';
import { createQueryClient } from '@/lib/query-client';

/** The app's own QueryClient (with its 401 handling) minus retries, so failures show at once. */
export function createTestQueryClient(): QueryClient {
  const client = createQueryClient();
  const defaults = client.getDefaultOptions();
  client.setDefaultOptions({ ...defaults, queries: { ...defaults.queries, retry: false } });
  return client;
}

interface Options extends Omit<RenderOptions, 'wrapper'> {
  route?: string;
  queryClient?: QueryClient;
}

/** Renders one component inside the same providers as the app, plus a router at `route`. */
export function renderWithProviders(ui: ReactElement, { route = '/', queryClient = createTestQueryClient(), ...options }: Options = {}) {
  const user = userEvent.setup();
  const result = render(
    <AppProvider queryClient={queryClient}>
      <MemoryRouter initialEntries={[route]}>{ui}</MemoryRouter>
    </AppProvider>,
    options,
  );
  return { user, queryClient, ...result };
}

/** Renders the whole app (real route table) at `route`; `router.state.location` shows where it went. */
export function renderApp(route: string, { queryClient = createTestQueryClient() }: { queryClient?: QueryClient } = {}) {
  const user = userEvent.setup();
  const router = createMemoryRouter(routes, { initialEntries: [route] });
  const result = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { user, router, queryClient, ...result };
}
