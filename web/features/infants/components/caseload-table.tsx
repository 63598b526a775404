import { useMemo } from 'react';
import type { ListInfantsQuery } from '@shared/schemas/infants';
import { Alert } from '../../../components/ui/alert';
import { CursorPager } from '../../../components/ui/data-table/cursor-pager';
import { TableFrame } from '../../../components/ui/data-table/table-frame';
import { useServerTable } from '../../../components/ui/data-table/use-server-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useMediaQuery, WIDE_SCREEN } from '../../../lib/use-media-query';
import { useInfants } from '../api/get-infants';
import { CaseloadCards, CaseloadSortChoice } from './caseload-cards';
import { caseloadColumnsFor, caseloadSort } from './caseload-columns';

interface CaseloadTableProps {
  query: ListInfantsQuery;
  update: (patch: Partial<ListInfantsQuery>) => void;
  emptyMessage: string;
}

export function CaseloadTable({ query, update, emptyMessage }: CaseloadTableProps) {
  const user = useSignedInUser();
  const columns = useMemo(() => caseloadColumnsFor(user.role), [user.role]);
  const infants = useInfants(query);
  const wide = useMediaQuery(WIDE_SCREEN, true);
  const table = useServerTable({
    columns,
    result: infants.data,
    view: query,
    update,
    sort: caseloadSort,
    // Lowest first on the first click for every column, numbers included, so the arrow means the same everywhere.
    sortDescFirst: false,
  });

  if (infants.isPending) return <Spinner label="Loading the caseload" />;
  if (infants.isError) return <Alert>{infants.error.message}</Alert>;

  const filtered = Boolean(query.q || query.status || query.flag || query.scope);
  const pager = (
    <CursorPager view={query} result={infants.data} noun={{ one: 'baby', other: 'babies' }} onChange={update} />
  );
  if (infants.data.items.length === 0) {
    return <EmptyState message={filtered ? 'No baby matches these filters.' : emptyMessage} />;
  }
  if (!wide) {
    return (
      <div className="flex flex-col gap-4">
        <CaseloadSortChoice query={query} update={update} />
        <CaseloadCards items={infants.data.items} showNurse={user.role !== 'nurse'} busy={infants.isPlaceholderData} />
        {pager}
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <TableFrame
        table={table}
        caption={`Babies in the caseload, ${infants.data.totalIsEstimate ? 'about ' : ''}${infants.data.total} in all`}
        minWidth="min-w-[56rem]"
        busy={infants.isPlaceholderData}
        compact
        // The name column stays put while the rest scrolls sideways on a phone.
        stickyFirstColumn
      />
      {pager}
    </div>
  );
}
