import { useCallback } from 'react';
import { listInfantsQuerySchema, type ListInfantsQuery } from '@shared/schemas/infants';
import { useUrlView } from '../../../lib/url-view';

/**
 * The caseload view lives in the address bar, so reload, back and a shared link all restore it. Pages are reached
 * by position (the cursor of the row next to them); any change other than turning a page (a filter, the sort, the
 * page size) starts again from the first page.
 */
export function useCaseloadView(options: { allowScope: boolean }) {
  // Only a consultant narrows by scope; a nurse's list is their own caseload by rule, whatever a link says.
  const adjust = useCallback((view: ListInfantsQuery) => (options.allowScope ? view : { ...view, scope: undefined }), [options.allowScope]);
  const { query, update } = useUrlView(listInfantsQuerySchema, adjust);
  const updateView = useCallback(
    (patch: Partial<ListInfantsQuery>, opts?: { replace?: boolean }) =>
      update('cursor' in patch ? patch : { ...patch, cursor: undefined, direction: 'next', page: patch.page ?? 1 }, opts),
    [update],
  );
  return { query, update: updateView };
}
