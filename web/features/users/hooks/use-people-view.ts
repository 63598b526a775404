import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { listUsersQuerySchema, type ListUsersQuery } from '../../../../shared/schemas/users';
import { readParam } from '../../../lib/url-param';

const shape = listUsersQuerySchema.shape;
const DEFAULTS = listUsersQuerySchema.parse({});

export function readPeopleView(params: URLSearchParams): ListUsersQuery {
  return {
    page: readParam(shape.page, params.get('page'), DEFAULTS.page),
    pageSize: readParam(shape.pageSize, params.get('pageSize'), DEFAULTS.pageSize),
    sort: readParam(shape.sort, params.get('sort'), DEFAULTS.sort),
    role: readParam(shape.role, params.get('role'), undefined),
    q: readParam(shape.q, params.get('q'), undefined) || undefined,
  };
}

export function writePeopleView(query: ListUsersQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.page !== DEFAULTS.page) params.set('page', String(query.page));
  if (query.pageSize !== DEFAULTS.pageSize) params.set('pageSize', String(query.pageSize));
  if (query.sort !== DEFAULTS.sort) params.set('sort', query.sort);
  if (query.role) params.set('role', query.role);
  if (query.q) params.set('q', query.q);
  return params;
}

/** The People view lives in the address bar, so reload, back and a shared link all restore it. */
export function usePeopleView() {
  const [params, setParams] = useSearchParams();
  const query = useMemo(() => readPeopleView(params), [params]);
  const update = useCallback(
    (patch: Partial<ListUsersQuery>) => setParams(writePeopleView({ ...query, ...patch })),
    [query, setParams],
  );
  return { query, update };
}
