import type { ComponentType } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { FullPageSpinner } from '../components/ui/spinner';
import { AppShell } from './layout/app-shell';
import { HomeRedirect } from './layout/home-redirect';
import { RequireAccess } from './layout/require-access';
import { RequireSession } from './layout/require-session';
import { RootLayout } from './layout/root-layout';
import { RouteError } from './layout/route-error';
import type { PageLoader } from './loaders/page-loader';

type PageModule = Promise<{ Component: ComponentType }>;
type LoaderModule = Promise<{ loader: PageLoader }>;

/**
 * One page: its component and, for the busiest pages, a loader, each its own chunk and loaded side by side by
 * React Router (the object form of `lazy`). The loader starts the page's queries (`queryClient.ensureQueryData` with
 * the features' query options) as soon as its small chunk arrives, while the page's larger code is still loading.
 */
function page(path: string, component: () => PageModule, loader?: () => LoaderModule) {
  return (queryClient: QueryClient): RouteObject => ({
    path,
    // Sorting, filtering and paging change only the query string: the page's useQuery asks at once, so the loader
    // runs when a page (or another baby) is opened, and a change within the page is not held up by it.
    shouldRevalidate: ({ currentUrl, nextUrl, defaultShouldRevalidate }) =>
      defaultShouldRevalidate && currentUrl.pathname !== nextUrl.pathname,
    // The loader first: its chunk is small, and asked for first it does not queue behind the page's chunks.
    lazy: {
      ...(loader && { loader: async () => (await loader()).loader(queryClient) }),
      Component: async () => (await component()).Component,
    },
  });
}

// Every page is its own chunk, so the first load carries only the shell and the session check.
const rolePages = [
  page('admin', () => import('./routes/admin-home.route'), () => import('./routes/admin-home.loader')),
  page('admin/people', () => import('./routes/people.route')),
  page('admin/settings', () => import('./routes/programme-settings.route')),
  page('coordinator', () => import('./routes/coordinator-home.route'), () => import('./routes/overview.loader')),
  page('enrol', () => import('./routes/enrol.route')),
  page('caseload', () => import('./routes/caseload.route'), () => import('./routes/caseload.loader')),
  page('infants/:id', () => import('./routes/infant-record.route'), () => import('./routes/infant-record.loader')),
  page('infants/:id/reading', () => import('./routes/reading.route')),
  page('infants/:id/recordings/new', () => import('./routes/recording-upload.route')),
  page('infants/:id/cylinder', () => import('./routes/infant-cylinder.route')),
  page('infants/:id/journeys/new', () => import('./routes/infant-journey.route')),
  page('journeys/:journeyId', () => import('./routes/journey-review.route')),
  page('recordings/:id', () => import('./routes/recording.route')),
  page('nurse', () => import('./routes/nurse-home.route'), () => import('./routes/nurse-home.loader')),
  page('consultant', () => import('./routes/consultant-home.route'), () => import('./routes/overview.loader')),
  page('sign-off', () => import('./routes/sign-off.route')),
  page('sign-off/:prescriptionId', () => import('./routes/sign-off-review.route')),
  page('family', () => import('./routes/family-home.route'), () => import('./routes/family-home.loader')),
  page('family/cylinder', () => import('./routes/family-cylinder.route')),
  page('family/journey', () => import('./routes/family-journey.route')),
  page('family/preferences', () => import('./routes/family-preferences.route')),
  page('messages', () => import('./routes/messages.route')),
  page('equipment-orders', () => import('./routes/equipment-orders.route')),
];

/** The app's routes; the loaders start queries in this client, the one the page components read. */
export const createAppRoutes = (queryClient: QueryClient): RouteObject[] => [
  {
    element: <RootLayout />,
    errorElement: <RouteError />,
    hydrateFallbackElement: <FullPageSpinner />,
    children: [
      { path: 'sign-in', lazy: () => import('./routes/sign-in.route') },
      { path: 'set-password', lazy: () => import('./routes/set-password.route') },
      // The oxygen supplier's page: no session, the signed link in the path is the credential.
      { path: 'supplier/orders/:token', lazy: () => import('./routes/supplier-order.route') },
      {
        element: <RequireSession />,
        children: [
          {
            element: <AppShell />,
            children: [
              {
                // Inside the shell, so header and navigation stay usable when one page fails.
                errorElement: <RouteError />,
                children: [
                  { index: true, element: <HomeRedirect /> },
                  { element: <RequireAccess />, children: rolePages.map((make) => make(queryClient)) },
                  { path: 'account/password', lazy: () => import('./routes/change-password.route') },
                  { path: '*', lazy: () => import('./routes/not-found.route') },
                ],
              },
            ],
          },
        ],
      },
    ],
  },
];

export const createAppRouter = (queryClient: QueryClient) => createBrowserRouter(createAppRoutes(queryClient));
