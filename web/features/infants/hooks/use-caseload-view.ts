import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { listInfantsQuerySchema, type ListInfantsQuery } from '../../../../shared/schemas/infants';
import { readParam } from '../../../lib/url-param';

const shape = listInfantsQuerySchema.shape;
const DEFAULTS = listInfantsQuerySchema.parse({});

export function readCaseloadView(params: URLSearchParams): ListInfantsQuery {
  return {
    page: readParam(shape.page, params.get('page'), DEFAULTS.page),
    pageSize: readParam(shape.pageSize, params.get('pageSize'), DEFAULTS.pageSize),
    sort: readParam(shape.sort, params.get('sort'), DEFAULTS.sort),
    status: readParam(shape.status, params.get('status'), undefined),
    flag: readParam(shape.flag, params.get('flag'), undefined),
    q: readParam(shape.q, params.get('q'), undefined) || undefined,
    scope: readParam(shape.scope, params.get('scope'), undefined),
  };
}

export function writeCaseloadView(query: ListInfantsQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.page !== DEFAULTS.page) params.set('page', String(query.page));
  if (query.pageSize !== DEFAULTS.pageSize) params.set('pageSize', String(query.pageSize));
  if (query.sort !== DEFAULTS.sort) params.set('sort', query.sort);
  if (query.status) params.set('status', query.status);
  if (query.flag) params.set('flag', query.flag);
  if (query.q) params.set('q', query.q);
  if (query.scope) params.set('scope', query.scope);
  return params;
}

/** The caseload view lives in the address bar, so reload, back and a shared link all restore it. */
export function useCaseloadView(options: { allowScope: boolean }) {
  const [params, setParams] = useSearchParams();
  const query = useMemo(() => {
    const view = readCaseloadView(params);
    // Only a consultant narrows by scope; a nurse's list is their own caseload by rule, whatever a link says.
    return options.allowScope ? view : { ...view, scope: undefined };
  }, [params, options.allowScope]);
  const update = useCallback(
    (patch: Partial<ListInfantsQuery>) => setParams(writeCaseloadView({ ...query, ...patch })),
    [query, setParams],
  );
  return { query, update };
}
