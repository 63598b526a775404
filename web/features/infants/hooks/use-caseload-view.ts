import { useCallback } from 'react';
import type { Role } from '@shared/auth/roles';
import { listInfantsQuerySchema, type ListInfantsQuery } from '@shared/schemas/infants';
import { readListView } from '@shared/http/list-view';
import { useUrlView } from '../../../lib/url-view';

/** Only a consultant narrows by scope; a nurse's list is their own caseload by rule, whatever a link says. */
export const offersMine = (role: Role): boolean => role === 'consultant';

const adjustFor = (role: Role) => (view: ListInfantsQuery): ListInfantsQuery => (offersMine(role) ? view : { ...view, scope: undefined });

/** The caseload view an address asks for, as the page reads it (the route loader asks for the same page). */
export const readCaseloadView = (params: URLSearchParams, role: Role): ListInfantsQuery =>
  adjustFor(role)(readListView(listInfantsQuerySchema, params));

/**
 * The caseload view lives in the address bar, so reload, back and a shared link all restore it. Pages are reached
 * by position (the cursor of the row next to them); any change other than turning a page (a filter, the sort, the
 * page size) starts again from the first page.
 */
export function useCaseloadView(role: Role) {
  const adjust = useCallback((view: ListInfantsQuery) => adjustFor(role)(view), [role]);
  const { query, update } = useUrlView(listInfantsQuerySchema, adjust);
  const updateView = useCallback(
    (patch: Partial<ListInfantsQuery>, opts?: { replace?: boolean }) =>
      update('cursor' in patch ? patch : { ...patch, cursor: undefined, direction: 'next', page: patch.page ?? 1 }, opts),
    [update],
  );
  return { query, update: updateView };
}
