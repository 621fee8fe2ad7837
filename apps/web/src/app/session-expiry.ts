import type { QueryClient } from '@tanstack/react-query';
import type { createBrowserRouter } from 'react-router-dom';
import { sessionKeys } from '@/features/session/api';
import { paths, signInHref } from '@/lib/paths';

type AppRouter = Pick<ReturnType<typeof createBrowserRouter>, 'state' | 'navigate'>;

/**
 * What the app does when a query is refused with 401 (the session ended while the user was
 * here): forget the session and ask the user to sign in, then come back to where they were.
 */
export function onSessionExpired(queryClient: QueryClient, router: AppRouter): void {
  queryClient.setQueryData(sessionKeys.me(), null);
  const { pathname, search } = router.state.location;
  if (pathname === paths.signIn) return;
  void router.navigate(signInHref(`${pathname}${search}`));
}
