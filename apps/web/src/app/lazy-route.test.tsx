import { screen } from '@testing-library/react';
import { Outlet, type RouteObject } from 'react-router-dom';
import { describe, expect, it, vi } from 'vitest';
import type { QueryClient } from '@tanstack/react-query';
import { defineRoute } from '@/lib/route-module';
import { json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { createTestQueryClient, renderRoute } from '@/testing/render';
import { lazyRoute } from './lazy-route';
import { RouteError } from './routes/route-error';

function chairScreen(queryClient: QueryClient) {
  const screenLoader = vi.fn(() => ({ rows: 40 }));
  const routes: RouteObject[] = [
    {
      element: <Outlet />,
      errorElement: <RouteError />,
      children: [
        {
          path: '/standing',
          ...lazyRoute(
            queryClient,
            async () => ({
              route: defineRoute({
                Component: () => <h1>Standing of SP27</h1>,
                loader: () => screenLoader,
              }),
            }),
            'chair',
          ),
        },
        { path: '/sign-in', element: <p>Sign-in screen</p> },
      ],
    },
  ];
  return { routes, screenLoader };
}

describe('lazyRoute with an audience', () => {
  it('sends a signed-out visitor to sign in, to come back afterwards', async () => {
    mockApi({ 'GET /api/auth/me': signedOut() });
    const queryClient = createTestQueryClient();
    const { routes, screenLoader } = chairScreen(queryClient);

    const { router } = renderRoute('/standing?call=SP27', { queryClient, routes });

    expect(await screen.findByText('Sign-in screen')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(new URLSearchParams(router.state.location.search).get('next')).toBe(
      '/standing?call=SP27',
    );
    expect(screenLoader).not.toHaveBeenCalled();
  });

  it('tells a user without the role who the screen is for, and loads nothing for them', async () => {
    mockApi({ 'GET /api/auth/me': json(makeSession({ roles: ['proposer', 'referee'] })) });
    const queryClient = createTestQueryClient();
    const { routes, screenLoader } = chairScreen(queryClient);

    renderRoute('/standing', { queryClient, routes });

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Not available to you' }),
    ).toBeInTheDocument();
    expect(screen.getByText('It is for committee chairs.')).toBeInTheDocument();
    expect(screenLoader).not.toHaveBeenCalled();
  });

  it('opens the screen, with its loader run, for a user with the role', async () => {
    mockApi({
      'GET /api/auth/me': json(
        makeSession({ roles: ['proposer'], callRoles: [{ callCode: 'SP27', role: 'chair' }] }),
      ),
    });
    const queryClient = createTestQueryClient();
    const { routes, screenLoader } = chairScreen(queryClient);

    renderRoute('/standing', { queryClient, routes });

    expect(await screen.findByRole('heading', { name: 'Standing of SP27' })).toBeInTheDocument();
    expect(screenLoader).toHaveBeenCalledTimes(1);
  });
});
