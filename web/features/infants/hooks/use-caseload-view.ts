import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { listInfantsQuerySchema, type ListInfantsQuery } from '../../../../shared/schemas/infants';

const shape = listInfantsQuerySchema.shape;
const DEFAULTS = listInfantsQuerySchema.parse({});

// Each parameter falls back on its own, so one bad value in a shared link does not reset the whole view.
function read<T>(schema: z.ZodType<T>, raw: string | null, fallback: T): T {
  const result = schema.safeParse(raw ?? undefined);
  return result.success ? result.data : fallback;
}

export function readCaseloadView(params: URLSearchParams): ListInfantsQuery {
  return {
    page: read(shape.page, params.get('page'), DEFAULTS.page),
    pageSize: read(shape.pageSize, params.get('pageSize'), DEFAULTS.pageSize),
    sort: read(shape.sort, params.get('sort'), DEFAULTS.sort),
    status: read(shape.status, params.get('status'), undefined),
    flag: read(shape.flag, params.get('flag'), undefined),
    q: read(shape.q, params.get('q'), undefined) || undefined,
    scope: read(shape.scope, params.get('scope'), undefined),
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
