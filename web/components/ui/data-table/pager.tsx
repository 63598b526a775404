import type { ReactTable, RowData } from '@tanstack/react-table';
import { Button } from '../button';
import { PageSizeSelect } from './page-size-select';
import type { ServerTableFeatures } from './use-server-table';

interface PagerProps<TData extends RowData> {
  table: ReactTable<ServerTableFeatures, TData>;
  total: number;
  /** What a row is, in the singular and the plural: `{ one: 'baby', other: 'babies' }`. */
  noun: { one: string; other: string };
}

export function Pager<TData extends RowData>({ table, total, noun }: PagerProps<TData>) {
  const { pageIndex, pageSize } = table.state.pagination;
  const pages = Math.max(1, table.getPageCount());
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
      <p className="text-ink-700">
        Page {pageIndex + 1} of {pages} · {total} {total === 1 ? noun.one : noun.other}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <PageSizeSelect value={pageSize} onChange={(size) => table.setPageSize(size)} />
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
