import { Link } from 'react-router-dom';
import type { Journey, JourneyPlan } from '@shared/schemas/journeys';
import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { errorMessage } from '../../../lib/api-error';
import { useInfantJourneys } from '../api/get-journeys';
import { datesWords, tripIsCurrent } from './journey-words';
import { TripCard } from './trip-card';

const hasPlan = (j: Journey): j is Journey & { plan: JourneyPlan } => j.plan !== null;

function statusSentence(j: Journey): string {
  const trip = `Your trip to ${j.request.destinationName} ${datesWords(j.request)}`;
  if (j.status === 'waiting') return `${trip}: waiting for the consultant to check it.`;
  if (j.status === 'declined') return `${trip}: the consultant did not approve the plan. Your home-care team will talk to you about it.`;
  // An approved trip with its figures shows in full above; this line is only for one the server sent without them.
  return `${trip} is approved. Your home-care team will give you the flow and the cylinders to take.`;
}

interface TripsProps {
  infantId: string;
  /** The family's today (YYYY-MM-DD, programme calendar). */
  today: string;
}

const byDeparture = (a: Journey, b: Journey) => a.request.departOn.localeCompare(b.request.departOn);

/** Approved trips, in full from the day they are approved until the return: the flow there and what to take. */
export function CurrentTrips({ infantId, today }: TripsProps) {
  const journeys = useInfantJourneys(infantId);
  const current = (journeys.data ?? []).filter((j) => tripIsCurrent(j, today)).filter(hasPlan).sort(byDeparture);
  return (
    <>
      {current.map((journey) => (
        <TripCard key={journey.id} journey={journey} />
      ))}
    </>
  );
}

/** Trips still ahead that are not approved yet as one line each (waiting, not approved), and the way to ask. */
export function PlanningATrip({ infantId, today, newTripHref }: TripsProps & { newTripHref: string }) {
  const journeys = useInfantJourneys(infantId);
  const others = (journeys.data ?? []).filter((j) => !tripIsCurrent(j, today) && j.request.returnOn >= today).sort(byDeparture);
  return (
    <Card title="Planning a trip?">
      <div className="flex flex-col gap-4">
        {journeys.isError && <Alert>{`Your trips could not be loaded. ${errorMessage(journeys.error)}`}</Alert>}
        {others.length > 0 && (
          <ul aria-label="Your trips" className="flex flex-col gap-3">
            {others.map((j) => (
              <li key={j.id} className="rounded-xl border border-surface-200 bg-surface-50 p-4 text-xl leading-relaxed text-ink-900">
                {statusSentence(j)}
              </li>
            ))}
          </ul>
        )}
        <p className="text-xl leading-relaxed text-ink-700">
          Going somewhere higher, or flying? Ask for a trip check: the consultant works out the oxygen your baby needs
          there and how many cylinders to take.
        </p>
        <Link
          to={newTripHref}
          className="inline-flex min-h-13 items-center justify-center self-start rounded-xl bg-brand-600 px-5 text-xl font-semibold text-white hover:bg-brand-700"
        >
          Ask for a trip check
        </Link>
      </div>
    </Card>
  );
}
