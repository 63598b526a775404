import { Link } from 'react-router-dom';
import type { DayVisit } from '@shared/schemas/schedule';
import { VISIT_KIND_LABELS } from '@shared/schemas/visits';
import { Badge } from '../../../components/ui/badge';
import { EmptyState } from '../../../components/ui/empty-state';
import { lengthText, visitCountText } from './day-format';

function DayVisitCard({ visit }: { visit: DayVisit }) {
  return (
    <li className="flex gap-3 rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm">
      {/* The family's wall-clock time, as booked: the time the nurse is expected at the door. */}
      <span className="w-16 shrink-0 text-xl font-bold tabular-nums text-brand-800">{visit.time}</span>
      <span className="flex min-w-0 flex-1 flex-col gap-1">
        <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <Link to={`/infants/${visit.infantId}`} className="text-lg font-bold text-brand-700 underline underline-offset-2">
            {visit.infantName}
          </Link>
          <Badge tone="brand">{VISIT_KIND_LABELS[visit.kind]}</Badge>
        </span>
        <span className="text-ink-900">{visit.homeAddress}</span>
        <span className="text-ink-900">{visit.purpose}</span>
        <span className="text-ink-700">{lengthText(visit.durationMinutes)}</span>
      </span>
    </li>
  );
}

/** Visits booked with the nurse today, by start time: fixed appointments come before the flexible round. */
export function DayVisits({ visits }: { visits: DayVisit[] }) {
  return (
    <section aria-labelledby="day-visits-heading" className="flex flex-col gap-3">
      <h2 id="day-visits-heading" className="text-lg font-bold text-ink-900">
        Visits today
        {visits.length > 0 && (
          <>
            {' '}
            <span className="font-semibold text-ink-700">· {visitCountText(visits.length)}, by start time</span>
          </>
        )}
      </h2>
      {visits.length === 0 ? (
        <EmptyState message="No visits are booked with you today." />
      ) : (
        <ol aria-label="Visits by start time" className="flex flex-col gap-3">
          {visits.map((visit) => <DayVisitCard key={visit.id} visit={visit} />)}
        </ol>
      )}
    </section>
  );
}
