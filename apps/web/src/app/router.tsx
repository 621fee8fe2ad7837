import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { PageLoader } from '@/components/ui/loading';
import { authPaths } from '@/features/auth/paths';
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
            {
              path: paths.calculator,
              ...lazyRoute(
                queryClient,
                () => import('@/features/calculator/routes/calculator'),
                audienceOf(paths.calculator),
              ),
            },
            {
              path: paths.calls,
              ...lazyRoute(queryClient, () => import('@/features/calls/routes/call-list')),
            },
            {
              path: `${paths.calls}/:code`,
              ...lazyRoute(queryClient, () => import('@/features/calls/routes/call-detail')),
            },
            {
              path: paths.proposals,
              ...lazyRoute(
                queryClient,
                () => import('@/features/proposals/routes/proposal-list'),
                audienceOf(paths.proposals),
              ),
            },
            {
              path: paths.newProposal,
              ...lazyRoute(
                queryClient,
                () => import('@/features/proposals/routes/new-proposal'),
                audienceOf(paths.proposals),
              ),
            },
            {
              // The optional segment is the editor's section: /proposals/SP27-0014/observations.
              path: `${paths.proposals}/:reference/:section?`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/proposals/routes/proposal-editor'),
                audienceOf(paths.proposals),
              ),
            },
            {
              path: paths.operations,
              ...lazyRoute(
                queryClient,
                () => import('@/features/operations/routes/operations-home'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: paths.operationsArray,
              ...lazyRoute(
                queryClient,
                () => import('@/features/operations/routes/array-setup'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: paths.operationsCalls,
              ...lazyRoute(
                queryClient,
                () => import('@/features/calls/routes/manage-calls'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: paths.newCall,
              ...lazyRoute(
                queryClient,
                () => import('@/features/calls/routes/call-new'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: `${paths.operationsCalls}/:code/edit`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/calls/routes/call-edit'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: paths.reviewing,
              ...lazyRoute(
                queryClient,
                () => import('@/features/reviewing/routes/assignments'),
                audienceOf(paths.reviewing),
              ),
            },
            {
              path: `${paths.reviewing}/:assignmentId`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/reviewing/routes/review'),
                audienceOf(paths.reviewing),
              ),
            },
            {
              path: paths.standing,
              ...lazyRoute(
                queryClient,
                () => import('@/features/standing/routes/standing-calls'),
                audienceOf(paths.standing),
              ),
            },
            {
              path: `${paths.standing}/:code`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/standing/routes/standing'),
                audienceOf(paths.standing),
              ),
            },
            {
              path: `${paths.standing}/:code/referees`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/reviewing/routes/referee-assignments'),
                audienceOf(paths.standing),
              ),
            },
            {
              path: paths.operationsAssessments,
              ...lazyRoute(
                queryClient,
                () => import('@/features/assessments/routes/assessment-calls'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: `${paths.operationsAssessments}/:code`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/assessments/routes/assessments'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: paths.operationsPlans,
              ...lazyRoute(
                queryClient,
                () => import('@/features/plan/routes/plan-calls'),
                audienceOf(paths.operations),
              ),
            },
            {
              path: `${paths.operationsPlans}/:code`,
              ...lazyRoute(
                queryClient,
                () => import('@/features/plan/routes/plan'),
                audienceOf(paths.operations),
              ),
            },
            ...(
              [
                [authPaths.signIn, () => import('@/features/auth/routes/sign-in')],
                [authPaths.register, () => import('@/features/auth/routes/register')],
                [authPaths.verify, () => import('@/features/auth/routes/verify')],
                [authPaths.forgotPassword, () => import('@/features/auth/routes/forgot-password')],
                [authPaths.resetPassword, () => import('@/features/auth/routes/reset-password')],
              ] as const
            ).map(([path, importer]) => ({ path, ...lazyRoute(queryClient, importer) })),
            {
              path: paths.profile,
              ...lazyRoute(
                queryClient,
                () => import('@/features/profile/routes/profile'),
                'signed-in',
              ),
            },
            {
              path: paths.accounts,
              ...lazyRoute(
                queryClient,
                () => import('@/features/accounts/routes/accounts'),
                audienceOf(paths.accounts),
              ),
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
