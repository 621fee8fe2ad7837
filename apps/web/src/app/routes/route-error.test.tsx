import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { Outlet, type RouteObject } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { renderRoute } from '@/testing/render';
import { RouteError } from './route-error';

describe('the route error page', () => {
  it('explains a failed load and loads again on "Try again"', async () => {
    let attempts = 0;
    const routes: RouteObject[] = [
      {
        element: <Outlet />,
        errorElement: <RouteError />,
        children: [
          {
            path: '/calls',
            loader: () => {
              attempts += 1;
              if (attempts === 1)
                throw new ApiError(500, 'INTERNAL', 'The server failed to list the calls.');
              return null;
            },
            element: <h1>Calls</h1>,
          },
        ],
      },
    ];
    renderRoute('/calls', { routes });

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Something went wrong' }),
    ).toBeInTheDocument();
    expect(screen.getByText('The server failed to list the calls.')).toBeInTheDocument();

    await userEvent.click(screen.getByRole('button', { name: 'Try again' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Calls' })).toBeInTheDocument();
    expect(attempts).toBe(2);
  });

  it('shows the not-found page for a 404 from the API', async () => {
    const routes: RouteObject[] = [
      {
        path: '/proposals/:reference',
        errorElement: <RouteError />,
        loader: () => {
          throw new ApiError(404, 'NOT_FOUND', 'No proposal SP27-9999.');
        },
        element: <h1>Proposal</h1>,
      },
    ];
    renderRoute('/proposals/SP27-9999', { routes });

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Page not found' }),
    ).toBeInTheDocument();
  });
});
