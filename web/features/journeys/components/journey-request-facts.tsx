import type { ReactNode } from 'react';
import { JOURNEY_STATUS_LABELS, type Journey } from '@shared/schemas/journeys';
import { Badge } from '../../../components/ui/badge';
import { formatDateTime } from '../../../lib/format';
import { destinationElevationWords, hoursWords, shortDayWords, wayWords } from './journey-words';
import { FactList } from '../../../components/ui/fact-list';

export const STATUS_TONES = { waiting: 'warn', approved: 'ok', declined: 'danger' } as const;

/** Whose trip and what was asked, so the consultant never decides a plan for the wrong baby or trip. */
export function JourneyRequestFacts({ journey }: { journey: Journey }) {
  const { request } = journey;
  const facts: [string, ReactNode][] = [
    ['Destination', request.destinationName],
    ['Destination elevation (as entered)', destinationElevationWords(request)],
    ['How', wayWords(request)],
    ['Dates', `${shortDayWords(request.departOn)} to ${shortDayWords(request.returnOn)}`],
    ['Away from home supply', hoursWords(request.hoursAway)],
    ['Asked by', `${journey.requestedBy.name || 'someone'} on ${formatDateTime(journey.createdAt)}`],
  ];
  if (request.notes) facts.push(['Notes', request.notes]);
  return (
    <section aria-label="Journey" className="rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="text-xl font-bold text-ink-900">{journey.infantName}</h2>
        <Badge tone={STATUS_TONES[journey.status]}>{JOURNEY_STATUS_LABELS[journey.status]}</Badge>
      </div>
      <FactList facts={facts} className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1" />
    </section>
  );
}
