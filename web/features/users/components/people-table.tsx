import { useMemo } from 'react';
import { useTable, type PaginationState, type SortingState, type Updater } from '@tanstack/react-table';
import type { User } from '../../../../shared/schemas/users';
import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useUsers } from '../api/get-users';
import { usePeopleView } from '../hooks/use-people-view';
import { peopleColumns, peopleFeatures, sortingToSort, sortToSorting } from './people-columns';
import { PeoplePager } from './people-pager';
import { SortHeader } from './sort-header';

const NO_ROWS: User[] = [];

const resolve = <T,>(updater: Updater<T>, current: T): T =>
  typeof updater === 'function' ? (updater as (old: T) => T)(current) : updater;

export function PeopleTable() {
  const { query, update } = usePeopleView();
  const users = useUsers(query);
  const sorting = useMemo(() => sortToSorting(query.sort), [query.sort]);
  const pagination = useMemo(() => ({ pageIndex: query.page - 1, pageSize: query.pageSize }), [query.page, query.pageSize]);

  const table = useTable({
    features: peopleFeatures,
    columns: peopleColumns,
    data: users.data?.items ?? NO_ROWS,
    rowCount: users.data?.total ?? 0,
    getRowId: (row) => row.id,
    manualSorting: true,
    manualPagination: true,
    autoResetPageIndex: false,
    enableMultiSort: false,
    enableSortingRemoval: false,
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

  if (users.isPending) return <Spinner label="Loading people" />;
  if (users.isError) return <Alert>{users.error.message}</Alert>;

  const filtered = Boolean(query.q || query.role);
  return (
    <div className="flex flex-col gap-4">
      <div className="relative overflow-x-auto rounded-xl border border-surface-200">
        <table className="w-full min-w-[44rem] border-collapse text-left">
          <caption className="sr-only">People in the programme, {users.data.total} in all</caption>
          <thead className="bg-surface-100 text-sm text-ink-700">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <SortHeader key={header.id} header={header}>
                    <table.FlexRender header={header} />
                  </SortHeader>
                ))}
              </tr>
            ))}
          </thead>
          <tbody aria-busy={users.isPlaceholderData || undefined}>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-surface-200 align-middle">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-3">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {users.data.items.length === 0 && (
        <EmptyState message={filtered ? 'No one matches this search.' : 'No accounts yet: add the first person above.'} />
      )}
      <PeoplePager table={table} total={users.data.total} />
    </div>
  );
}
