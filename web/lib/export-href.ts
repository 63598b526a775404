import type { z } from 'zod';
import { writeListView } from '@shared/http/list-view';

// Paging says which rows a page shows; an export holds every row the filters match.
const PAGING = ['page', 'pageSize', 'cursor', 'direction'];

/** The address of a CSV export carrying a list view's filters, search and sort (only what differs from the defaults). */
export function exportHref<S extends z.ZodObject<z.ZodRawShape>>(path: string, schema: S, view: z.infer<S>): string {
  const params = writeListView(schema, view);
  for (const key of PAGING) params.delete(key);
  const query = params.toString();
  return query ? `${path}?${query}` : path;
}
