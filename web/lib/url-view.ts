import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { readParam } from './url-param';

type ViewSchema = z.ZodObject<z.ZodRawShape>;

/**
 * A list view (page, size, sort, filters) read from the address bar, one parameter per schema key. Each key falls
 * back to its default on its own, so one bad value in a shared link does not reset the whole view; an empty text
 * filter counts as none.
 */
export function readUrlView<S extends ViewSchema>(schema: S, params: URLSearchParams): z.infer<S> {
  const defaults = schema.parse({}) as Record<string, unknown>;
  const view: Record<string, unknown> = {};
  for (const [key, field] of Object.entries(schema.shape)) {
    const value = readParam(field as z.ZodType<unknown>, params.get(key), defaults[key]);
    view[key] = value === '' ? undefined : value;
  }
  return view as z.infer<S>;
}

/** The address-bar form of a view: only what differs from the defaults, so links stay short. */
export function writeUrlView<S extends ViewSchema>(schema: S, view: z.infer<S>): URLSearchParams {
  const defaults = schema.parse({}) as Record<string, unknown>;
  const params = new URLSearchParams();
  for (const key of Object.keys(schema.shape)) {
    const value = (view as Record<string, unknown>)[key];
    if (value !== undefined && value !== '' && value !== defaults[key]) params.set(key, String(value));
  }
  return params;
}

/** The view lives in the address bar, so reload, back and a shared link all restore it. */
export function useUrlView<S extends ViewSchema>(schema: S, adjust: (view: z.infer<S>) => z.infer<S> = (v) => v) {
  const [params, setParams] = useSearchParams();
  const query = useMemo(() => adjust(readUrlView(schema, params)), [params, schema, adjust]);
  const update = useCallback(
    // `replace`: a change made while typing (a search box) replaces the history entry instead of adding one per pause.
    (patch: Partial<z.infer<S>>, opts: { replace?: boolean } = {}) => setParams(writeUrlView(schema, { ...query, ...patch }), { replace: opts.replace }),
    [query, schema, setParams],
  );
  return { query, update };
}
