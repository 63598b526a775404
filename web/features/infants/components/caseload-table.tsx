import { useMemo } from 'react';
import { useTable, type PaginationState, type SortingState, type Updater } from '@tanstack/react-table';
import type { InfantSummary, ListInfantsQuery } from '../../../../shared/schemas/infants';
import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useInfants } from '../api/get-infants';
import { caseloadColumnsFor, caseloadFeatures, sortingToSort, sortToSorting } from './caseload-columns';
import { CaseloadPager } from './caseload-pager';
import { CaseloadSortHeader } from './caseload-sort-header';

const NO_ROWS: InfantSummary[] = [];

const resolve = <T,>(updater: Updater<T>, current: T): T =>
  typeof updater === 'function' ? (updater as (old: T) => T)(current) : updater;

// The name column stays put while the rest scrolls sideways on a phone.
const STICKY = 'sticky left-0 z-10';

interface CaseloadTableProps {
  query: ListInfantsQuery;
  update: (patch: Partial<ListInfantsQuery>) => void;
  emptyMessage: string;
}

export function CaseloadTable({ query, update, emptyMessage }: CaseloadTableProps) {
  const user = useSignedInUser();
  const columns = useMemo(() => caseloadColumnsFor(user.role), [user.role]);
  const infants = useInfants(query);
  const sorting = useMemo(() => sortToSorting(query.sort), [query.sort]);
  const pagination = useMemo(() => ({ pageIndex: query.page - 1, pageSize: query.pageSize }), [query.page, query.pageSize]);

  const table = useTable({
    features: caseloadFeatures,
    columns,
    data: infants.data?.items ?? NO_ROWS,
    rowCount: infants.data?.total ?? 0,
    getRowId: (row) => row.id,
    manualSorting: true,
    manualPagination: true,
    autoResetPageIndex: false,
    enableMultiSort: false,
    enableSortingRemoval: false,
    // Lowest first on the first click for every column, numbers included, so the arrow means the same everywhere.
    sortDescFirst: false,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      const next = resolve<SortingState>(updater, sorting);
      update({ sort: sortingToSort(next, query.sort), page: 1 });
    },
    onPaginationChange: (updater) => {
      const next = resolve<PaginationState>(updater, pagination);
      const sizeChanged = next.pageSize !== pagination.pageSize;
      update({ page: sizeChanged ? 1 : next.pageIndex + 1, pageSize: next.pageSize });
    },
  });

  if (infants.isPending) return <Spinner label="Loading the caseload" />;
  if (infants.isError) return <Alert>{infants.error.message}</Alert>;

  const filtered = Boolean(query.q || query.status || query.flag || query.scope);
  if (infants.data.items.length === 0) {
    return <EmptyState message={filtered ? 'No baby matches these filters.' : emptyMessage} />;
  }
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-500 md:hidden">Swipe the table sideways to see every column.</p>
      <div className="relative overflow-x-auto rounded-xl border border-surface-200">
        <table className="w-full min-w-[56rem] border-collapse text-left">
          <caption className="sr-only">Babies in the caseload, {infants.data.total} in all</caption>
          <thead className="bg-surface-100 text-sm text-ink-700">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header, index) => (
                  <CaseloadSortHeader key={header.id} header={header} className={index === 0 ? `${STICKY} bg-surface-100` : ''}>
                    <table.FlexRender header={header} />
                  </CaseloadSortHeader>
                ))}
              </tr>
            ))}
          </thead>
          <tbody aria-busy={infants.isPlaceholderData || undefined} className="bg-surface-0">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-surface-200 bg-surface-0 align-middle">
                {row.getAllCells().map((cell, index) => (
                  <td key={cell.id} className={`px-2 py-3 ${index === 0 ? `${STICKY} max-w-40 bg-surface-0` : ''}`}>
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <CaseloadPager table={table} total={infants.data.total} />
    </div>
  );
}
