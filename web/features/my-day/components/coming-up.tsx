import { Link } from 'react-router-dom';
import type { DayItem } from '@shared/schemas/schedule';
import { CHECK_KIND_LABELS } from '@shared/schemas/schedule';
import { formatShortDay } from './day-format';

/** The next seven days, read-only: lets a nurse see a follow-up study coming before it is due. */
export function ComingUp({ items }: { items: DayItem[] }) {
  if (items.length === 0) return null;
  return (
    <section aria-labelledby="coming-up-heading" className="flex flex-col gap-2">
      <h2 id="coming-up-heading" className="text-lg font-bold text-ink-900">Coming up this week</h2>
      <ul className="flex flex-col divide-y divide-surface-200 rounded-xl border border-surface-200 bg-white">
        {items.map((item) => (
          <li key={item.id} className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1 px-4 py-3">
            <Link to={`/infants/${item.infantId}`} className="font-semibold text-brand-700 underline underline-offset-2">{item.infantName}</Link>
            <span className="text-ink-700">
              {CHECK_KIND_LABELS[item.kind]} · due {formatShortDay(item.dueDate)}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
