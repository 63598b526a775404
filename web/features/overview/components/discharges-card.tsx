import { Link } from 'react-router-dom';
import type { CoordinatorOverview } from '@shared/schemas/overview';
import { EmptyState } from '../../../components/ui/empty-state';
import { calendarDate, plural } from './overview-format';

/** Babies going home: a discharge date ahead, or the checklist under way; each with what is still missing. */
export function DischargesCard({ discharges }: { discharges: CoordinatorOverview['discharges'] }) {
  const { withDate, preparing, babies } = discharges;
  const total = withDate + preparing;
  return (
    <section aria-labelledby="going-home" className="flex flex-col gap-3 rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
      <h2 id="going-home" tabIndex={-1} className="text-lg font-bold text-ink-900">Going home</h2>
      <p className="text-ink-700">
        {withDate} {plural(withDate, 'baby', 'babies')} with a discharge date, {preparing} being prepared.
      </p>
      {total === 0 ? <EmptyState message="No baby is being prepared to go home." /> : (
        <>
          <ul aria-label="Babies going home" className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
            {babies.map((b) => (
              <li key={b.infantId} className="flex flex-col gap-0.5 px-3 py-2">
                <div className="flex flex-wrap items-baseline justify-between gap-x-3">
                  <Link to={`/infants/${b.infantId}`} className="font-semibold text-brand-800 underline">{b.infantName}</Link>
                  <span className="text-ink-700">{b.dischargedOn ? `goes home ${calendarDate(b.dischargedOn)}` : 'no date yet'}</span>
                </div>
                <p className={b.missing.length ? 'text-warn-800' : 'text-ok-800'}>
                  {b.missing.length
                    ? `${b.missing.length} ${plural(b.missing.length, 'step', 'steps')} missing: ${b.missing.map((m) => m.label).join('; ')}`
                    : 'Every step done'}
                </p>
              </li>
            ))}
          </ul>
          {total > babies.length && <p className="text-ink-700">and {total - babies.length} more; each baby’s record shows its checklist.</p>}
        </>
      )}
    </section>
  );
}
