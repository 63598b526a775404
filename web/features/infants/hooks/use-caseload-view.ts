import { useCallback } from 'react';
import { listInfantsQuerySchema, type ListInfantsQuery } from '../../../../shared/schemas/infants';
import { useUrlView } from '../../../lib/url-view';

/** The caseload view lives in the address bar, so reload, back and a shared link all restore it. */
export function useCaseloadView(options: { allowScope: boolean }) {
  // Only a consultant narrows by scope; a nurse's list is their own caseload by rule, whatever a link says.
  const adjust = useCallback((view: ListInfantsQuery) => (options.allowScope ? view : { ...view, scope: undefined }), [options.allowScope]);
  return useUrlView(listInfantsQuerySchema, adjust);
}
