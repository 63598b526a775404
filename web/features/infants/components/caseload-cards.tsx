import { Fact } from '../../../components/ui/fact';
import { Link } from 'react-router-dom';
import { INFANT_STATUS_LABELS, type InfantSummary, type ListInfantsQuery } from '@shared/schemas/infants';
import { Badge } from '../../../components/ui/badge';
import { currentFlowText, placeText, STATUS_TONES } from './caseload-columns';
import { FlagList } from './flag-badge';

const SORT_CHOICES: [ListInfantsQuery['sort'], string][] = [
  ['name', 'Name, A to Z'], ['-name', 'Name, Z to A'],
  ['correctedAge', 'Corrected age, youngest first'], ['-correctedAge', 'Corrected age, oldest first'],
  ['elevation', 'Home elevation, lowest first'], ['-elevation', 'Home elevation, highest first'],
  ['status', 'Status'], ['-status', 'Status, reversed'],
];

/** On a phone the table's column headers are gone, so the order is chosen here; it is the same `sort` in the URL. */
export function CaseloadSortChoice({ query, update }: { query: ListInfantsQuery; update: (patch: Partial<ListInfantsQuery>) => void }) {
  const known = SORT_CHOICES.some(([value]) => value === query.sort);
  return (
    <label className="flex flex-col gap-1 font-semibold text-ink-900">
      Sort by
      <select value={query.sort} onChange={(event) => update({ sort: event.target.value as ListInfantsQuery['sort'], page: 1 })}
        className="min-h-11 rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal">
        {!known && <option value={query.sort}>{query.sort}</option>}
        {SORT_CHOICES.map(([value, label]) => <option key={value} value={value}>{label}</option>)}
      </select>
    </label>
  );
}

/**
 * One card per baby on a narrow screen: every column of the table, stacked, so nothing needs a sideways swipe. A
 * phone shows three or four of the page's cards; the browser lays out and paints the others only as they scroll
 * near (`content-visibility: auto`, sized meanwhile as a card usually is, 246–343 px on a 390 px phone, then as last drawn).
 */
export function CaseloadCards({ items, showNurse, busy }: { items: InfantSummary[]; showNurse: boolean; busy: boolean }) {
  return (
    <ul aria-label="Babies in the caseload" aria-busy={busy || undefined} className={`flex flex-col gap-3 ${busy ? 'opacity-60' : ''}`}>
      {items.map((row) => (
        <li key={row.id} className="rounded-xl border border-surface-200 bg-surface-0 p-4 shadow-sm [content-visibility:auto] [contain-intrinsic-size:auto_17rem]">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 className="text-lg font-bold">
              <Link to={`/infants/${row.id}`} className="text-brand-700 underline underline-offset-2">{row.name}</Link>
            </h2>
            <Badge tone={STATUS_TONES[row.status]}>{INFANT_STATUS_LABELS[row.status]}</Badge>
          </div>
          <FlagList flags={row.flags} className="mt-2 flex flex-wrap gap-1.5" />
          <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-2">
            <Fact label="Current flow">{currentFlowText(row)}</Fact>
            <Fact label="Corrected age">{row.correctedAge}</Fact>
            <Fact label="Home elevation">{placeText(row)}</Fact>
            {showNurse && <Fact label="Nurse">{row.nurse?.name ?? '—'}</Fact>}
            <Fact label="Consultant">{row.consultant?.name ?? '—'}</Fact>
          </dl>
        </li>
      ))}
    </ul>
  );
}
