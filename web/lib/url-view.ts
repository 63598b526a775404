import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { readListView, writeListView } from '@shared/http/list-view';

type ViewSchema = z.ZodObject<z.ZodRawShape>;

/** The view lives in the address bar, so reload, back and a shared link all restore it. */
export function useUrlView<S extends ViewSchema>(schema: S, adjust: (view: z.infer<S>) => z.infer<S> = (v) => v) {
  const [params, setParams] = useSearchParams();
  const query = useMemo(() => adjust(readListView(schema, params)), [params, schema, adjust]);
  const update = useCallback(
    // `replace`: a change made while typing (a search box) replaces the history entry instead of adding one per pause.
    (patch: Partial<z.infer<S>>, opts: { replace?: boolean } = {}) => setParams(writeListView(schema, { ...query, ...patch }), { replace: opts.replace }),
    [query, schema, setParams],
  );
  return { query, update };
}
