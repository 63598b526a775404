import type { EnsureQueryDataOptions, QueryClient, QueryKey } from '@tanstack/react-query';
import type { LoaderFunction, Params } from 'react-router-dom';
import type { SessionUser } from '@shared/schemas/session';
import { sessionQueryOptions } from '../../features/session/api/session-keys';
import { abilityForSessionUser } from '../../lib/ability';
import { canVisit } from '../navigation';

export interface PageRequest {
  user: SessionUser;
  url: URL;
  params: Params;
}

/** Starts one query through `queryClient.ensureQueryData`; the page reads it with `useQuery` and the same options. */
export type Ensure = <TQueryFnData, TError, TData, TQueryKey extends QueryKey>(
  options: EnsureQueryDataOptions<TQueryFnData, TError, TData, TQueryKey>,
) => void;

/** A route loader, made once the router knows its query client (web/app/router.tsx). */
export type PageLoader = (queryClient: QueryClient) => LoaderFunction;

/**
 * A route loader that starts the page's queries as soon as the route's loader code has arrived, alongside the page's
 * own code, instead of after the page has rendered. It asks only for the signed-in person's pages, with the same
 * rule as the menu and `RequireAccess`: a signed-out visitor or another role's page starts nothing, so nothing is
 * read into the cache for the wrong person. It does not wait for the data: the page shows its own loading and
 * error states as before, and a 401 ends the local session through the API client as on any request.
 */
export function pageLoader(start: (request: PageRequest, ensure: Ensure) => void): PageLoader {
  return (queryClient) =>
    async ({ request, params }) => {
      // The session query is already on its way (web/main.tsx); a failure is the session guard's to show.
      const session = await queryClient.ensureQueryData(sessionQueryOptions()).catch(() => null);
      const user = session?.user;
      const url = new URL(request.url);
      if (!user || !canVisit(url.pathname, user.role, abilityForSessionUser(user))) return null;
      start({ user, url, params }, (options) => {
        // A failed first load is left to the page's useQuery, which fetches again on mount and shows the error.
        queryClient.ensureQueryData(options).catch(() => undefined);
      });
      return null;
    };
}
