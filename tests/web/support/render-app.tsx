import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProviders, createAppQueryClient } from '../../../web/app/providers';
import { createAppRoutes } from '../../../web/app/router';

/** The real routes, providers and API client, in memory, starting at `path`. */
export function renderApp(path: string) {
  const queryClient = createAppQueryClient({ retry: false });
  const router = createMemoryRouter(createAppRoutes(queryClient), { initialEntries: [path] });
  const user = userEvent.setup();
  render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { router, queryClient, user };
}

export const currentUrl = (router: ReturnType<typeof createMemoryRouter>) =>
  `${router.state.location.pathname}${router.state.location.search}`;
