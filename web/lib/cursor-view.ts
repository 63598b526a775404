import { useCallback } from 'react';
import type { z } from 'zod';
import { useUrlView } from './url-view';

interface CursorView { page: number; cursor?: string; direction: 'next' | 'prev' }
type CursorViewSchema = z.ZodObject<z.ZodRawShape> & z.ZodType<CursorView>;

/**
 * A list view in the address bar whose pages are reached by position (the cursor of the row beside them, see
 * components/ui/data-table/cursor-pager.tsx). Turning a page sends its cursor; any other change (a filter, the
 * search, the sort, the page size) starts again from the first page, since a cursor belongs to the list it came from.
 */
export function useCursorUrlView<S extends CursorViewSchema>(schema: S) {
  const { query, update } = useUrlView(schema);
  const updateView = useCallback(
    (patch: Partial<z.infer<S>>, opts?: { replace?: boolean }) =>
      update('cursor' in patch ? patch : ({ ...patch, cursor: undefined, direction: 'next', page: patch.page ?? 1 } as Partial<z.infer<S>>), opts),
    [update],
  );
  return { query, update: updateView };
}
