import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import type { Reading } from '@shared/schemas/readings';
import type { DayItem } from '@shared/schemas/schedule';
import { PageHeader } from '../../components/ui/page-header';
import { infantKeys } from '../../features/infants/api/infant-keys';
import { useRefreshMyDay } from '../../features/my-day/api/get-my-day';
import { completesWithReading } from '../../features/my-day/components/day-format';
import { MyDayList } from '../../features/my-day/components/my-day-list';
import { ReadingForm } from '../../features/readings/components/reading-form';
import { SavedReading } from '../../features/readings/components/saved-reading';
import { usePageTitle } from '../../lib/page-title';

interface JustSaved {
  infantId: string;
  readingId: string;
  infantName: string;
}

export function Component() {
  usePageTitle('My day');
  const queryClient = useQueryClient();
  const refreshDay = useRefreshMyDay();
  // Which readings this visit to the page saved: ids only, the readings themselves live in the query cache.
  const [saved, setSaved] = useState<JustSaved[]>([]);

  const onSaved = (item: DayItem) => (reading: Reading) => {
    setSaved((list) => [{ infantId: reading.infantId, readingId: reading.id, infantName: item.infantName }, ...list]);
    void refreshDay();
    // A reading can clear an overdue flag or bring a new weight, which the caseload and the record show.
    void queryClient.invalidateQueries({ queryKey: infantKeys.all });
  };

  return (
    <>
      <PageHeader title="My day" intro="Today’s checks and any overdue ones, in the order of your round. Tap a baby to log the reading." />
      <div className="flex max-w-2xl flex-col gap-6">
        {saved.length > 0 && (
          <section aria-label="Just saved" className="flex flex-col gap-3">
            {saved.map((entry) => (
              <SavedReading key={entry.readingId} {...entry}
                onDismiss={() => setSaved((list) => list.filter((other) => other.readingId !== entry.readingId))} />
            ))}
          </section>
        )}
        <MyDayList
          renderForm={(item) => (
            <ReadingForm infantId={item.infantId} checkId={completesWithReading(item) ? item.id : undefined}
              defaultFlowLpm={item.activeFlowLpm} onSaved={onSaved(item)} />
          )}
        />
        <p className="text-ink-700">
          Seeing a baby who is not on this list?{' '}
          <Link to="/caseload" className="font-semibold text-brand-700 underline">Open your caseload</Link> to log a reading for them.
        </p>
      </div>
    </>
  );
}
