import type { QueryClient } from '@tanstack/react-query';
import { data, redirect, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { canAccess, type Audience } from '@/features/session/access';
import { sessionQueryOptions } from '@/features/session/api';
import { signInHref } from '@/lib/paths';
import type { RouteModule } from '@/lib/route-module';

/** What a 403 route error carries, so the error page can say who the screen is for. */
export interface ForbiddenData {
  audience: Audience;
}

/**
 * Sends a signed-out user to sign in (and back here after) and refuses, with 403, a user who
 * lacks the audience's role. It decides only what the interface shows; the API checks rights.
 */
export async function requireAudience(
  queryClient: QueryClient,
  audience: Audience,
  { request }: Pick<LoaderFunctionArgs, 'request'>,
): Promise<void> {
  if (audience === 'everyone') return;
  const session = await queryClient.ensureQueryData(sessionQueryOptions());
  if (canAccess(session, audience)) return;
  if (!session) {
    const url = new URL(request.url);
    throw redirect(signInHref(`${url.pathname}${url.search}`));
  }
  throw data<ForbiddenData>({ audience }, { status: 403, statusText: 'Forbidden' });
}

type RouteImporter = () => Promise<{ route: RouteModule }>;

/**
 * A route whose module is fetched only when first visited (its own chunk). The access check
 * runs before the module's loader, so no data is asked for on behalf of someone who may not
 * see it.
 */
export function lazyRoute(
  queryClient: QueryClient,
  importer: RouteImporter,
  audience: Audience = 'everyone',
): Pick<RouteObject, 'loader' | 'lazy'> {
  return {
    loader: async (args) => {
      await requireAudience(queryClient, audience, args);
      const { route } = await importer();
      return route.loader ? route.loader(queryClient)(args) : null;
    },
    lazy: async () => {
      const { route } = await importer();
      return { Component: route.Component };
    },
  };
}
