import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { PageLoader } from '@/components/ui/loading';
import { paths } from '@/lib/paths';
import { AppLayout } from './layout/app-layout';
import { lazyRoute } from './lazy-route';
import { audienceOf } from './nav';
import { RouteError } from './routes/route-error';
import { NotFoundPage } from './routes/not-found';

/**
 * Every screen of the app. Screens come from features (`features/<name>/routes/*.tsx`, each
 * exporting `route`) and are loaded lazily; give each the audience of its navigation item.
 */
export function createRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      id: 'root',
      element: <AppLayout />,
      // Shown without the frame only if the frame itself fails.
      errorElement: <RouteError />,
      HydrateFallback: PageLoader,
      children: [
        {
          // Screen errors render inside the frame, so the header and navigation stay usable.
          errorElement: <RouteError />,
          children: [
            {
              index: true,
              ...lazyRoute(queryClient, () => import('./routes/desk'), audienceOf(paths.desk)),
            },
            { path: '*', element: <NotFoundPage /> },
          ],
        },
      ],
    },
  ];
}

export const createAppRouter = (queryClient: QueryClient) =>
  createBrowserRouter(createRoutes(queryClient));
