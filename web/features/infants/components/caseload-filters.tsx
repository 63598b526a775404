import {
  INFANT_FLAG_KIND_LABELS,
  INFANT_FLAG_KINDS,
  INFANT_FLAGS,
  INFANT_FLAG_LABELS,
  INFANT_STATUSES,
  INFANT_STATUS_LABELS,
  type ListInfantsQuery,
} from '@shared/schemas/infants';
import { SearchForm } from '../../../components/ui/data-table/search-form';
import { SelectFilter } from '../../../components/ui/data-table/select-filter';

// The menu names each flag's kind too, as the badges do.
const FLAG_CHOICES = Object.fromEntries(
  INFANT_FLAGS.map((flag) => [flag, `${INFANT_FLAG_KIND_LABELS[INFANT_FLAG_KINDS[flag]]}: ${INFANT_FLAG_LABELS[flag]}`]),
) as typeof INFANT_FLAG_LABELS;

interface CaseloadFiltersProps {
  query: ListInfantsQuery;
  update: (patch: Partial<ListInfantsQuery>) => void;
  /** Consultants may narrow to the babies they are responsible for. */
  offerMine: boolean;
}

export function CaseloadFilters({ query, update, offerMine }: CaseloadFiltersProps) {
  return (
    <div className="flex flex-wrap items-end gap-3">
      <SearchForm label="Search by name" value={query.q} onSearch={(q) => update({ q, page: 1 })} width="w-56" />
      <SelectFilter
        label="Status"
        value={query.status}
        options={INFANT_STATUSES}
        labels={INFANT_STATUS_LABELS}
        anyLabel="Any status"
        onChange={(status) => update({ status, page: 1 })}
      />
      <SelectFilter
        label="Flag"
        value={query.flag}
        options={INFANT_FLAGS}
        labels={FLAG_CHOICES}
        anyLabel="Any or none"
        onChange={(flag) => update({ flag, page: 1 })}
      />
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
