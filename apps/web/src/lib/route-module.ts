import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunction } from 'react-router-dom';

/**
 * What a route module under `features/<feature>/routes/` exports as `route`. The router loads
 * it lazily, so each screen is its own chunk.
 */
export interface RouteModule {
  Component: ComponentType;
  /**
   * Made with the app's QueryClient. Start the screen's queries here with
   * `queryClient.ensureQueryData(xQueryOptions(params))` so the screen renders with its data
   * and the same cache entry serves the component's `useQuery`.
   */
  loader?: (queryClient: QueryClient) => LoaderFunction;
}

export const defineRoute = (route: RouteModule): RouteModule => route;
