import type { FormEvent } from 'react';
import {
  INFANT_FLAGS,
  INFANT_FLAG_LABELS,
  INFANT_STATUSES,
  INFANT_STATUS_LABELS,
  type InfantFlag,
  type InfantStatus,
  type ListInfantsQuery,
} from '../../../../shared/schemas/infants';
import { Button } from '../../../components/ui/button';

const isStatus = (value: string): value is InfantStatus => (INFANT_STATUSES as readonly string[]).includes(value);
const isFlag = (value: string): value is InfantFlag => (INFANT_FLAGS as readonly string[]).includes(value);

interface CaseloadFiltersProps {
  query: ListInfantsQuery;
  update: (patch: Partial<ListInfantsQuery>) => void;
  /** Consultants may narrow to the babies they are responsible for. */
  offerMine: boolean;
}

const selectClasses = 'min-h-11 rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal';

export function CaseloadFilters({ query, update, offerMine }: CaseloadFiltersProps) {
  const onSearch = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const q = String(new FormData(event.currentTarget).get('q') ?? '').trim();
    update({ q: q || undefined, page: 1 });
  };
  return (
    <div className="flex flex-wrap items-end gap-3">
      <form role="search" onSubmit={onSearch} className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 font-semibold">
          Search by name
          {/* Keyed on the URL value so back and forward refill the box with what was searched. */}
          <input
            key={query.q ?? ''}
            name="q"
            type="search"
            defaultValue={query.q ?? ''}
            maxLength={100}
            className="min-h-11 w-56 max-w-full rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal"
          />
        </label>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </form>
      <label className="flex flex-col gap-1 font-semibold">
        Status
        <select
          value={query.status ?? ''}
          onChange={(event) => update({ status: isStatus(event.target.value) ? event.target.value : undefined, page: 1 })}
          className={selectClasses}
        >
          <option value="">Any status</option>
          {INFANT_STATUSES.map((status) => (
            <option key={status} value={status}>
              {INFANT_STATUS_LABELS[status]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 font-semibold">
        Flag
        <select
          value={query.flag ?? ''}
          onChange={(event) => update({ flag: isFlag(event.target.value) ? event.target.value : undefined, page: 1 })}
          className={selectClasses}
        >
          <option value="">Any or none</option>
          {INFANT_FLAGS.map((flag) => (
            <option key={flag} value={flag}>
              {INFANT_FLAG_LABELS[flag]}
            </option>
          ))}
        </select>
      </label>
      {offerMine && (
        <label className="flex min-h-11 items-center gap-2 font-semibold">
          <input
            type="checkbox"
            checked={query.scope === 'mine'}
            onChange={(event) => update({ scope: event.target.checked ? 'mine' : undefined, page: 1 })}
            className="size-5 accent-brand-600"
          />
          Only mine
        </label>
      )}
    </div>
  );
}
