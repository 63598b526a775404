import type { z } from 'zod';

// A list's view (page, size, sort, filters) as it travels in addresses: read from a page's query string by the web
// app, and by the server when it names, in the page it sends, the API request that page will make (spa-page.ts).
// Both sides read and write it here, so the two requests are the same and the browser hands the page the answer.

type ViewSchema = z.ZodObject<z.ZodRawShape>;

/**
 * Reads one parameter of a list view from the address bar. Each parameter falls back on its own, so one bad
 * value in a shared link does not reset the whole view.
 */
export function readParam<T>(schema: z.ZodType<T>, raw: string | null, fallback: T): T {
  const result = schema.safeParse(raw ?? undefined);
  return result.success ? result.data : fallback;
}

/**
 * A list view read from a query string, one parameter per schema key. Each key falls back to its default on its
 * own, so one bad value in a shared link does not reset the whole view; an empty text filter counts as none.
 */
export function readListView<S extends ViewSchema>(schema: S, params: URLSearchParams): z.infer<S> {
  const defaults = schema.parse({}) as Record<string, unknown>;
  const view: Record<string, unknown> = {};
  for (const [key, field] of Object.entries(schema.shape)) {
    const value = readParam(field as z.ZodType<unknown>, params.get(key), defaults[key]);
    view[key] = value === '' ? undefined : value;
  }
  return view as z.infer<S>;
}

/** The address-bar form of a view: only what differs from the defaults, so links stay short. */
export function writeListView<S extends ViewSchema>(schema: S, view: z.infer<S>): URLSearchParams {
  const defaults = schema.parse({}) as Record<string, unknown>;
  const params = new URLSearchParams();
  for (const key of Object.keys(schema.shape)) {
    const value = (view as Record<string, unknown>)[key];
    if (value !== undefined && value !== '' && value !== defaults[key]) params.set(key, String(value));
  }
  return params;
}

export type QueryParams = Record<string, string | number | boolean | undefined | null>;

/** An API address with its query: every given value in the object's order, empty ones left out. */
export function apiPath(path: string, query?: QueryParams): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const search = params.toString();
  return search ? `${path}?${search}` : path;
}
