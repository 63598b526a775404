import { useSearchParams } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { FoldedSection } from '../../../components/ui/folded-section';
import { ScrollRegion } from '../../../components/ui/scroll-region';
import { SelectField, TextField } from '../../../components/ui/field';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { usePeople, useReads } from '../api/get-reads';
import type { ReadFilters } from '../api/audit-keys';

// The filters live in the address (reads-by, reads-from, reads-to), like the other tables' state.
function useReadFilters(): [ReadFilters, (name: 'reads-by' | 'reads-from' | 'reads-to', value: string) => void] {
  const [params, setParams] = useSearchParams();
  const filters: ReadFilters = {
    actorId: params.get('reads-by') || undefined,
    from: params.get('reads-from') || undefined,
    to: params.get('reads-to') || undefined,
  };
  const set = (name: string, value: string) =>
    setParams((prev) => {
      const next = new URLSearchParams(prev);
      if (value) next.set(name, value);
      else next.delete(name);
      return next;
    }, { replace: true });
  return [filters, set];
}

/** Admin: who opened this baby's record, what they looked at, when and from where; filterable by person and day. */
export function ReadsSection({ infantId }: { infantId: string }) {
  const [filters, setFilter] = useReadFilters();
  const reads = useReads(infantId, filters);
  const people = usePeople();
  const rows = reads.data?.pages.flatMap((p) => p.items) ?? [];
  return (
    <FoldedSection title="Who looked at this record" summary="Every opening of the record, its plan, readings, recordings, journeys and printed plan.">
      <div className="mb-4 grid gap-3 sm:grid-cols-3">
        <SelectField label="Person" value={filters.actorId ?? ''} onChange={(e) => setFilter('reads-by', e.target.value)}>
          <option value="">Everyone</option>
          {people.data?.items.map((u) => (
            <option key={u.id} value={u.id}>{u.name} ({u.role})</option>
          ))}
        </SelectField>
        <TextField label="From" type="date" value={filters.from ?? ''} onChange={(e) => setFilter('reads-from', e.target.value)} />
        <TextField label="To" type="date" value={filters.to ?? ''} onChange={(e) => setFilter('reads-to', e.target.value)} />
      </div>
      {reads.isPending && <Spinner label="Loading who looked at this record" />}
      {reads.isError && <Alert>{reads.error.message}</Alert>}
      {reads.data && rows.length === 0 && <EmptyState message="Nobody has looked at this record in that time." />}
      {rows.length > 0 && (
        <ScrollRegion label="Who looked at this record, newest first" className="relative overflow-x-auto">
          <table className="w-full border-collapse text-left text-sm">
            <caption className="sr-only">Who looked at this record, newest first</caption>
            <thead className="bg-surface-100 text-ink-700">
              <tr>
                <th scope="col" className="px-3 py-2 font-semibold">When</th>
                <th scope="col" className="px-3 py-2 font-semibold">Who</th>
                <th scope="col" className="px-3 py-2 font-semibold">What</th>
                <th scope="col" className="px-3 py-2 font-semibold">From address</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.id} className="border-t border-surface-200 align-top">
                  <td className="whitespace-nowrap px-3 py-2 text-ink-700">{formatDateTime(r.at)}</td>
                  <td className="px-3 py-2 text-ink-900">{r.person ? `${r.person.name} (${r.person.role})` : 'Someone no longer listed'}</td>
                  <td className="px-3 py-2 text-ink-900">{r.words}</td>
                  <td className="px-3 py-2 font-mono text-ink-700">{r.ip ?? '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollRegion>
      )}
      {reads.hasNextPage && (
        <Button variant="secondary" className="mt-3" onClick={() => reads.fetchNextPage()} disabled={reads.isFetchingNextPage}>
          {reads.isFetchingNextPage ? 'Loading older reads…' : 'Show older reads'}
        </Button>
      )}
    </FoldedSection>
  );
}
