import { useMemo } from 'react';
import {
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type PaginationState,
  type SortingState,
  type TableOptions,
  type Updater,
} from '@tanstack/react-table';
import type { UrlSort } from './url-sort';

export const serverTableFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature });
export type ServerTableFeatures = typeof serverTableFeatures;

/** The part of a list's URL view that the table itself reads and writes. */
export interface PagedView<TSort extends string> {
  page: number;
  pageSize: number;
  sort: TSort;
}

interface ServerTableOptions<TData extends { id: string }, TSort extends string> {
  columns: TableOptions<ServerTableFeatures, TData>['columns'];
  /** The current page from the server, or nothing while the first one loads. */
  result: { items: TData[]; total: number } | undefined;
  view: PagedView<TSort>;
  update: (patch: Partial<PagedView<TSort>>) => void;
  sort: UrlSort<TSort>;
  sortDescFirst?: boolean;
}

const resolve = <T>(updater: Updater<T>, current: T): T =>
  typeof updater === 'function' ? (updater as (old: T) => T)(current) : updater;

// One stable empty array, so a loading table does not see new data on every render.
const NO_ROWS: never[] = [];

/** The server pages and sorts; the table only shows the page and turns clicks into a new URL view. */
export function useServerTable<TData extends { id: string }, TSort extends string>(options: ServerTableOptions<TData, TSort>) {
  const { columns, result, view, update, sort, sortDescFirst } = options;
  const sorting = useMemo(() => sort.toSorting(view.sort), [sort, view.sort]);
  const pagination = useMemo(() => ({ pageIndex: view.page - 1, pageSize: view.pageSize }), [view.page, view.pageSize]);

  return useTable({
    features: serverTableFeatures,
    columns,
    data: result?.items ?? NO_ROWS,
    rowCount: result?.total ?? 0,
    getRowId: (row) => row.id,
    manualSorting: true,
    manualPagination: true,
    autoResetPageIndex: false,
    enableMultiSort: false,
    enableSortingRemoval: false,
    sortDescFirst,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      const next = resolve<SortingState>(updater, sorting);
      update({ sort: sort.toSort(next, view.sort), page: 1 });
    },
    onPaginationChange: (updater) => {
      const next = resolve<PaginationState>(updater, pagination);
      const sizeChanged = next.pageSize !== pagination.pageSize;
      update({ page: sizeChanged ? 1 : next.pageIndex + 1, pageSize: next.pageSize });
    },
  });
}
