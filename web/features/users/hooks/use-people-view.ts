import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { listUsersQuerySchema, type ListUsersQuery } from '../../../../shared/schemas/users';

const shape = listUsersQuerySchema.shape;
const DEFAULTS = listUsersQuerySchema.parse({});

// Each parameter falls back on its own, so one bad value in a shared link does not reset the whole view.
function read<T>(schema: z.ZodType<T>, raw: string | null, fallback: T): T {
  const result = schema.safeParse(raw ?? undefined);
  return result.success ? result.data : fallback;
}

export function readPeopleView(params: URLSearchParams): ListUsersQuery {
  return {
    page: read(shape.page, params.get('page'), DEFAULTS.page),
    pageSize: read(shape.pageSize, params.get('pageSize'), DEFAULTS.pageSize),
    sort: read(shape.sort, params.get('sort'), DEFAULTS.sort),
    role: read(shape.role, params.get('role'), undefined),
    q: read(shape.q, params.get('q'), undefined) || undefined,
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
