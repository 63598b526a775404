import type { ReactTable, RowData } from '@tanstack/react-table';
import { Button } from '../button';
import type { ServerTableFeatures } from './use-server-table';

const PAGE_SIZES = [10, 25, 50, 100];

interface PagerProps<TData extends RowData> {
  table: ReactTable<ServerTableFeatures, TData>;
  total: number;
  /** What a row is, in the singular and the plural: `{ one: 'baby', other: 'babies' }`. */
  noun: { one: string; other: string };
}

export function Pager<TData extends RowData>({ table, total, noun }: PagerProps<TData>) {
  const { pageIndex, pageSize } = table.state.pagination;
  const pages = Math.max(1, table.getPageCount());
  // A hand-edited link may ask for a size the menu does not list; show it rather than lie about it.
  const sizes = PAGE_SIZES.includes(pageSize) ? PAGE_SIZES : [...PAGE_SIZES, pageSize].sort((a, b) => a - b);
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
      <p className="text-ink-700">
        Page {pageIndex + 1} of {pages} · {total} {total === 1 ? noun.one : noun.other}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <label className="flex items-center gap-2 text-sm text-ink-700">
          Rows per page
          <select
            value={pageSize}
            onChange={(event) => table.setPageSize(Number(event.target.value))}
            className="min-h-9 rounded-lg border border-surface-300 bg-surface-0 px-2"
          >
            {sizes.map((size) => (
              <option key={size} value={size}>
                {size}
              </option>
            ))}
          </select>
        </label>
        <Button variant="secondary" size="sm" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          Previous page
        </Button>
        <Button variant="secondary" size="sm" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Next page
        </Button>
      </div>
    </nav>
  );
}
