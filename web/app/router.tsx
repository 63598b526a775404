import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { FullPageSpinner } from '../components/ui/spinner';
import { AppShell } from './layout/app-shell';
import { HomeRedirect } from './layout/home-redirect';
import { RequireAccess } from './layout/require-access';
import { RequireSession } from './layout/require-session';
import { RootLayout } from './layout/root-layout';
import { RouteError } from './layout/route-error';

// Every page is its own chunk, so the first load carries only the shell and the session check.
const rolePages: RouteObject[] = [
  { path: 'admin', lazy: () => import('./routes/admin-home.route') },
  { path: 'admin/people', lazy: () => import('./routes/people.route') },
  { path: 'admin/settings', lazy: () => import('./routes/programme-settings.route') },
  { path: 'coordinator', lazy: () => import('./routes/coordinator-home.route') },
  { path: 'enrol', lazy: () => import('./routes/enrol.route') },
  { path: 'caseload', lazy: () => import('./routes/caseload.route') },
  { path: 'infants/:id', lazy: () => import('./routes/infant-record.route') },
  { path: 'infants/:id/reading', lazy: () => import('./routes/reading.route') },
  { path: 'infants/:id/recordings/new', lazy: () => import('./routes/recording-upload.route') },
  { path: 'infants/:id/cylinder', lazy: () => import('./routes/infant-cylinder.route') },
  { path: 'infants/:id/journeys/new', lazy: () => import('./routes/infant-journey.route') },
  { path: 'journeys/:journeyId', lazy: () => import('./routes/journey-review.route') },
  { path: 'recordings/:id', lazy: () => import('./routes/recording.route') },
  { path: 'nurse', lazy: () => import('./routes/nurse-home.route') },
  { path: 'consultant', lazy: () => import('./routes/consultant-home.route') },
  { path: 'sign-off', lazy: () => import('./routes/sign-off.route') },
  { path: 'sign-off/:prescriptionId', lazy: () => import('./routes/sign-off-review.route') },
  { path: 'family', lazy: () => import('./routes/family-home.route') },
  { path: 'family/cylinder', lazy: () => import('./routes/family-cylinder.route') },
  { path: 'family/journey', lazy: () => import('./routes/family-journey.route') },
  { path: 'family/preferences', lazy: () => import('./routes/family-preferences.route') },
  { path: 'messages', lazy: () => import('./routes/messages.route') },
  { path: 'equipment-orders', lazy: () => import('./routes/equipment-orders.route') },
];

export const appRoutes: RouteObject[] = [
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
                  { element: <RequireAccess />, children: rolePages },
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

export const createAppRouter = () => createBrowserRouter(appRoutes);
