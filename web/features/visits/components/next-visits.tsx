import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useNow } from '../../../lib/use-now';
import { useInfantVisits } from '../api/get-visits';
import { upcomingVisits, visitSentence } from './visit-words';

/** The family's view: only visits still to come, one plain sentence each. */
export function NextVisits({ infantId }: { infantId: string | undefined }) {
  const visits = useInfantVisits(infantId);
  const now = useNow();
  const upcoming = visits.data ? upcomingVisits(visits.data.items, now) : [];
  return (
    <Card title="Next visits">
      {visits.isLoading && <Spinner label="Loading your visits" />}
      {upcoming.length > 0 ? (
        <ul aria-label="Your next visits" className="flex flex-col gap-3">
          {upcoming.map((visit) => (
            <li key={visit.id} className="rounded-xl border border-surface-200 bg-surface-50 p-4 text-xl leading-relaxed text-ink-900">
              {visitSentence(visit)}
            </li>
          ))}
        </ul>
      ) : (
        !visits.isLoading && <EmptyState large message="Visits booked by your home-care team will show here." />
      )}
    </Card>
  );
}
