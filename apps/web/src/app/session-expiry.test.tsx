import { useQuery } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { sessionKeys } from '@/features/session/api';
import { api } from '@/lib/api-client';
import { createQueryClient } from '@/lib/query-client';
import { apiError, makeSession, mockApi } from '@/testing/mock-api';
import { AppProvider } from './provider';
import { onSessionExpired } from './session-expiry';

function ProposalList() {
  const proposals = useQuery({
    queryKey: ['proposals'],
    queryFn: () => api.get<unknown[]>('/proposals'),
  });
  return <p>{proposals.isError ? 'Failed' : 'Listing'}</p>;
}

describe('a 401 from a query', () => {
  it('forgets the session and sends the user to sign in, then back', async () => {
    mockApi({ 'GET /api/proposals': apiError(401, 'UNAUTHENTICATED', 'Your session ended.') });
    const queryClient = createQueryClient({
      onUnauthorized: () => onSessionExpired(queryClient, router),
    });
    queryClient.setQueryData(sessionKeys.me(), makeSession());
    const router = createMemoryRouter(
      [
        { path: '/proposals', element: <ProposalList /> },
        { path: '/sign-in', element: <p>Sign-in screen</p> },
      ],
      { initialEntries: ['/proposals?mine=1'] },
    );

    render(
      <AppProvider queryClient={queryClient}>
        <RouterProvider router={router} />
      </AppProvider>,
    );

    expect(await screen.findByText('Sign-in screen')).toBeInTheDocument();
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent('/proposals?mine=1')}`);
    await waitFor(() => expect(queryClient.getQueryData(sessionKeys.me())).toBeNull());
  });
});
