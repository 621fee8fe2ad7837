import { QueryClient } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactElement } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { AppProvider } from '@/app/provider';
import { createRoutes } from '@/app/router';

/** A client per test, so no answer leaks from one test into the next; no retries to wait for. */
export const createTestQueryClient = () =>
  new QueryClient({
    defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } },
  });

export function renderWithProviders(ui: ReactElement, queryClient = createTestQueryClient()) {
  return { queryClient, ...render(<AppProvider queryClient={queryClient}>{ui}</AppProvider>) };
}

/** The whole app (or the given routes) at `path`, in a memory router. */
export function renderRoute(
  path: string,
  {
    queryClient = createTestQueryClient(),
    routes,
  }: { queryClient?: QueryClient; routes?: RouteObject[] } = {},
) {
  const router = createMemoryRouter(routes ?? createRoutes(queryClient), {
    initialEntries: [path],
  });
  return { router, ...renderWithProviders(<RouterProvider router={router} />, queryClient) };
}
