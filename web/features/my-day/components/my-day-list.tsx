import { useState, type ReactNode } from 'react';
import type { DayItem } from '@shared/schemas/schedule';
import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useMyDay } from '../api/get-my-day';
import { countText, formatLongDay } from './day-format';
import { DayItemCard } from './day-item-card';
import { ComingUp } from './coming-up';
import { DayVisits } from './day-visits';

/** Today's booked visits, then today's and overdue checks in the order the server plans the round; one card open at a time. */
export function MyDayList({ renderForm }: { renderForm: (item: DayItem) => ReactNode }) {
  const day = useMyDay();
  const [openId, setOpenId] = useState<string | null>(null);

  if (day.isPending) return <Spinner label="Loading today’s checks" />;
  if (day.isError) return <Alert>{day.error.message}</Alert>;
  const { date, items, upcoming, visits } = day.data;
  // Checks done today stay in the list, so each stop keeps its number all day.
  const left = items.filter((item) => item.status !== 'done').length;
  const done = items.length - left;

  return (
    <div className="flex flex-col gap-6">
      <DayVisits visits={visits} />
      <section aria-labelledby="day-heading" className="flex flex-col gap-3">
        <h2 id="day-heading" className="text-lg font-bold text-ink-900">
          {formatLongDay(date)}
          {items.length > 0 && (
            <>
              {' '}
              <span className="font-semibold text-ink-700">
                · {countText(items.length)}, in route order{done > 0 ? `, ${done} done` : ''}
              </span>
            </>
          )}
        </h2>
        {items.length === 0 ? (
          <EmptyState large message="Nothing due today." />
        ) : (
          <ol aria-label="Checks in route order" className="flex flex-col gap-3">
            {items.map((item, index) => (
              <DayItemCard key={item.id} item={item} stop={index + 1} today={date} open={openId === item.id && item.status !== 'done'}
                onToggle={() => setOpenId((current) => (current === item.id ? null : item.id))}>
                {renderForm(item)}
              </DayItemCard>
            ))}
          </ol>
        )}
        <ComingUp items={upcoming} />
      </section>
    </div>
  );
}
