import { Link } from 'react-router-dom';
import type { Journey } from '@shared/schemas/journeys';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useWaitingJourneys } from '../api/get-waiting-journeys';
import { shortDayWords, wayWords } from './journey-words';

export const NO_JOURNEYS_WAITING = 'No journey checks are waiting.';

function FlowThere({ journey }: { journey: Journey }) {
  if (!journey.plan) return <span className="text-ink-700">not worked out</span>;
  if (journey.plan.exceedsCannula) return <span className="font-bold text-danger-800">Cannot be met by cannula — decide</span>;
  const flow = journey.plan.supplyFlowLpm;
  return <span className="font-bold tabular-nums text-ink-900">{flow === null ? '—' : `up to ${formatFlow(flow)} L/min`}</span>;
}

function WaitingJourneyCard({ journey }: { journey: Journey }) {
  const { request } = journey;
  return (
    <article aria-label={`${journey.infantName}: trip to ${request.destinationName}`} className="flex flex-col gap-2 rounded-xl border border-surface-200 bg-surface-0 p-4 shadow-sm">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <h3 className="text-lg font-bold text-ink-900">{journey.infantName}</h3>
        <Badge tone="brand">{request.mode === 'flight' ? 'Flight' : 'Road trip'}</Badge>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        <dt className="text-ink-500">To</dt>
        <dd className="text-ink-900">{request.destinationName} · {wayWords(request)}</dd>
        <dt className="text-ink-500">Leaving</dt>
        <dd className="text-ink-900">{shortDayWords(request.departOn)}</dd>
        <dt className="text-ink-500">Flow there</dt>
        <dd><FlowThere journey={journey} /></dd>
        <dt className="text-ink-500">Asked</dt>
        <dd className="text-ink-900">{formatDateTime(journey.createdAt)}</dd>
      </dl>
      <Link
        to={`/journeys/${journey.id}`}
        aria-label={`Review journey: ${journey.infantName}, trip to ${request.destinationName}`}
        className="mt-1 inline-flex min-h-11 items-center justify-center self-start rounded-lg bg-brand-600 px-4 font-semibold text-white hover:bg-brand-700"
      >
        Review journey
      </Link>
    </article>
  );
}

/** Journey checks waiting for a consultant, oldest request first, as the server sends them. */
export function WaitingJourneys() {
  const waiting = useWaitingJourneys();
  if (waiting.isPending) return <Spinner label="Loading the journey checks" />;
  if (waiting.isError) return <Alert>{errorMessage(waiting.error)}</Alert>;
  if (waiting.data.length === 0) return <EmptyState message={NO_JOURNEYS_WAITING} />;
  return (
    <ol aria-label="Journey checks waiting" className="grid gap-3 lg:grid-cols-2">
      {waiting.data.map((journey) => (
        <li key={journey.id}>
          <WaitingJourneyCard journey={journey} />
        </li>
      ))}
    </ol>
  );
}
