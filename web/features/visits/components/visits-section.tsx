import { useState } from 'react';
import { useNow } from '../../../lib/use-now';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useInfantVisits } from '../api/get-visits';
import { BookVisitForm } from './book-visit-form';
import { VisitItem } from './visit-item';
import { earlierVisits, upcomingVisits, visitsToMarkDone } from './visit-words';

const listClasses = 'flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200';

/**
 * Booked visits first, then past ones nobody has marked done yet; cancelled and done ones stay out of the way but a
 * click away.
 */
export function VisitsSection({ infantId, canManage }: { infantId: string; canManage: boolean }) {
  const visits = useInfantVisits(infantId);
  const [booking, setBooking] = useState(false);
  const now = useNow();
  const items = visits.data?.items ?? [];
  const upcoming = upcomingVisits(items, now);
  const toMarkDone = visitsToMarkDone(items, now);
  const earlier = earlierVisits(items);
  const book = canManage && !booking ? <Button variant="secondary" size="sm" onClick={() => setBooking(true)}>Book a visit</Button> : undefined;
  return (
    <Card title="Visits" actions={book}>
      <div className="flex flex-col gap-4">
        {booking && <BookVisitForm infantId={infantId} onClose={() => setBooking(false)} />}
        {visits.isPending && <Spinner label="Loading visits" />}
        {visits.isError && <Alert>{visits.error.message}</Alert>}
        {visits.data && upcoming.length === 0 && <EmptyState message="No visits booked." />}
        {upcoming.length > 0 && (
          <ul aria-label="Booked visits" className={listClasses}>
            {upcoming.map((visit) => <VisitItem key={visit.id} visit={visit} canManage={canManage} />)}
          </ul>
        )}
        {toMarkDone.length > 0 && (
          <section aria-labelledby={`visits-to-mark-done-${infantId}`} className="flex flex-col gap-2">
            <h3 id={`visits-to-mark-done-${infantId}`} className="font-bold text-ink-900">Past visits not marked done ({toMarkDone.length})</h3>
            <ul aria-label="Past visits not marked done" className={listClasses}>
              {toMarkDone.map((visit) => <VisitItem key={visit.id} visit={visit} canManage={canManage} />)}
            </ul>
          </section>
        )}
        {earlier.length > 0 && (
          <details>
            <summary className="cursor-pointer font-semibold text-brand-700">Cancelled and done visits ({earlier.length})</summary>
            <ul aria-label="Cancelled and done visits" className={`mt-2 ${listClasses}`}>
              {earlier.map((visit) => <VisitItem key={visit.id} visit={visit} canManage={false} />)}
            </ul>
          </details>
        )}
      </div>
    </Card>
  );
}
