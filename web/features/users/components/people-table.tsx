import { Alert } from '../../../components/ui/alert';
import { CursorPager } from '../../../components/ui/data-table/cursor-pager';
import { TableFrame } from '../../../components/ui/data-table/table-frame';
import { useServerTable } from '../../../components/ui/data-table/use-server-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useUsers } from '../api/get-users';
import { usePeopleView } from '../hooks/use-people-view';
import { peopleColumns, peopleSort } from './people-columns';

export function PeopleTable() {
  const { query, update } = usePeopleView();
  const users = useUsers(query);
  const table = useServerTable({ columns: peopleColumns, result: users.data, view: query, update, sort: peopleSort });

  if (users.isPending) return <Spinner label="Loading people" />;
  if (users.isError) return <Alert>{users.error.message}</Alert>;

  const filtered = Boolean(query.q || query.role);
  return (
    <div className="flex flex-col gap-4">
      <TableFrame
        table={table}
        caption={`People in the programme, ${users.data.totalIsEstimate ? 'about ' : ''}${users.data.total} in all`}
        minWidth="min-w-[44rem]"
        busy={users.isPlaceholderData}
      />
      {users.data.items.length === 0 && (
        <EmptyState message={filtered ? 'No one matches this search.' : 'No accounts yet: add the first person above.'} />
      )}
      <CursorPager view={query} result={users.data} noun={{ one: 'person', other: 'people' }} onChange={update} />
    </div>
  );
}
