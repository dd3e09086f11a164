import { lazy, type ComponentType } from 'react';
import { createBrowserRouter, Navigate, type LoaderFunctionArgs } from 'react-router-dom';
import { authKeys } from '@/features/auth/api/keys';
import { boresQueryOptions } from '@/features/bores/api/get-bores';
import { pitsQueryOptions } from '@/features/bores/api/get-pits';
import { holesQueryOptions } from '@/features/holes/api/get-holes';
import { conflictsQueryOptions } from '@/features/conflicts/api/get-conflicts';
import { linesQueryOptions } from '@/features/lines/api/get-lines';
import { clearancesQueryOptions as planClearancesQueryOptions } from '@/features/plan/api/get-clearances';
import { tilesetQueryOptions } from '@/features/plan/api/get-tileset';
import { projectQueryOptions } from '@/features/projects/api/get-project';
import { projectsQueryOptions } from '@/features/projects/api/get-projects';
import { queryClient } from '@/lib/query-client';
import { AppShell } from './layout/app-shell';
import { RouteError } from './layout/route-error';
import { NotFound } from './routes/not-found';

/** A route module loaded on first visit, so the first page stays small. */
function page(load: () => Promise<{ default: ComponentType }>) {
  const Page = lazy(load);
  return <Page />;
}

/**
 * Loaders only start fetches (never awaited), so a page's code and its data load together and
 * navigation is never held up; components read the same queries. Nothing is prefetched before
 * the session is known, to spare a round of 401s.
 */
function prefetch(args: LoaderFunctionArgs, start: (projectId: number) => Promise<void>[]): null {
  const projectId = Number(args.params.projectId);
  if (queryClient.getQueryData(authKeys.session()) && Number.isInteger(projectId) && projectId > 0) void Promise.all(start(projectId));
  return null;
}

export const router = createBrowserRouter([
  {
    path: '/sign-in',
    errorElement: <RouteError />,
    element: page(() => import('./routes/sign-in')),
  },
  {
    path: '/',
    element: <AppShell />,
    errorElement: <RouteError />,
    hydrateFallbackElement: null,
    children: [
      // Managers land on a conflict register, everyone else on the projects (see routes/landing.tsx).
      { index: true, element: page(() => import('./routes/landing')) },
      {
        path: 'projects',
        loader: () => {
          if (queryClient.getQueryData(authKeys.session())) void queryClient.prefetchQuery(projectsQueryOptions());
          return null;
        },
        element: page(() => import('./routes/projects')),
      },
      {
        path: 'projects/:projectId',
        loader: (args) => prefetch(args, (id) => [queryClient.prefetchQuery(projectQueryOptions(id))]),
        element: page(() => import('./routes/project/workspace')),
        children: [
          // The plan view will become the landing tab once it exists.
          { index: true, element: <Navigate to="holes" replace /> },
          {
            path: 'plan',
            loader: (args) =>
              prefetch(args, (id) => [
                queryClient.prefetchQuery(boresQueryOptions(id)),
                queryClient.prefetchQuery(pitsQueryOptions(id)),
                queryClient.prefetchQuery(linesQueryOptions(id)),
                queryClient.prefetchQuery(holesQueryOptions(id)),
                queryClient.prefetchQuery(planClearancesQueryOptions(id)),
                queryClient.prefetchQuery(tilesetQueryOptions(id)),
              ]),
            element: page(() => import('./routes/project/plan')),
          },
          {
            path: 'holes',
            loader: (args) =>
              prefetch(args, (id) => [
                queryClient.prefetchQuery(holesQueryOptions(id)),
                queryClient.prefetchQuery(linesQueryOptions(id)),
                queryClient.prefetchQuery(boresQueryOptions(id)),
              ]),
            element: page(() => import('./routes/project/holes')),
          },
          // Test holes: log one, import survey shots, one hole, edit it (issue 4).
          { path: 'holes/new', element: page(() => import('./routes/project/hole-new')) },
          { path: 'holes/import', element: page(() => import('./routes/project/holes-import')) },
          { path: 'holes/:holeId', element: page(() => import('./routes/project/hole-detail')) },
          { path: 'holes/:holeId/edit', element: page(() => import('./routes/project/hole-edit')) },
          {
            path: 'lines',
            loader: (args) => prefetch(args, (id) => [queryClient.prefetchQuery(linesQueryOptions(id))]),
            element: page(() => import('./routes/project/lines')),
          },
          { path: 'lines/:lineId', element: page(() => import('./routes/project/line-detail')) },
          {
            path: 'bores',
            loader: (args) => prefetch(args, (id) => [queryClient.prefetchQuery(boresQueryOptions(id)), queryClient.prefetchQuery(pitsQueryOptions(id))]),
            element: page(() => import('./routes/project/bores')),
          },
          {
            path: 'conflicts',
            loader: (args) => prefetch(args, (id) => [queryClient.prefetchQuery(conflictsQueryOptions(id))]),
            element: page(() => import('./routes/project/conflicts')),
          },
          // One conflict: figures, workflow, assignment, history (issue 6).
          { path: 'conflicts/:conflictId', element: page(() => import('./routes/project/conflict-detail')) },
          { path: 'stake-out', element: page(() => import('./routes/project/stake-out')) },
          { path: 'exports', element: page(() => import('./routes/project/exports')) },
          { path: 'activity', element: page(() => import('./routes/project/activity')) },
          { path: 'settings', element: page(() => import('./routes/project/settings')) },
          { path: '*', element: <NotFound /> },
        ],
      },
      { path: 'users', element: page(() => import('./routes/users')) },
      // Admin → Mail: the outbox and the development mail catcher (issue 6).
      { path: 'mail', element: page(() => import('./routes/mail')) },
      { path: '*', element: <NotFound /> },
    ],
  },
]);
