import { Link } from 'react-router-dom';
import type { CoordinatorOverview as Data } from '@shared/schemas/overview';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { useOverview } from '../api/get-overview';
import { BabiesByStatus } from './babies-by-status';
import { DischargesCard } from './discharges-card';
import { FigureGrid, FigureLink } from './figure-link';
import { OverviewLoadState } from './load-state';
import { OnOxygenCard } from './on-oxygen-card';
import { calendarDate, plural, waitedFor } from './overview-format';

const oldest = (since: string | null, asOf: string, none: string) => (since ? `Oldest has waited ${waitedFor(since, asOf)}` : none);

function JourneysWaiting({ o }: { o: Data }) {
  const { count, oldest: items } = o.journeysWaiting;
  return (
    <section aria-labelledby="journeys-waiting" className="flex flex-col gap-3 rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
      <h2 id="journeys-waiting" tabIndex={-1} className="text-lg font-bold text-ink-900">Journey checks waiting for a consultant</h2>
      {count === 0 ? <EmptyState message="No journey check is waiting." /> : (
        <>
          <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
            {items.map((j) => (
              <li key={j.id} className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-0.5 px-3 py-2">
                <Link to={`/journeys/${j.id}`} className="font-semibold text-brand-800 underline">{j.infantName} to {j.destinationName}</Link>
                <span className="text-ink-700">leaves {calendarDate(j.departOn)} · waiting {waitedFor(j.waitingSince, o.asOf)}</span>
              </li>
            ))}
          </ul>
          {count > items.length && <p className="text-ink-700">and {count - items.length} more; each baby’s record lists its journeys.</p>}
        </>
      )}
    </section>
  );
}

export function CoordinatorFigures({ o }: { o: Data }) {
  const { signOff, overdueChecks, messagesNeedingAction: messages, journeysWaiting, equipmentOrders: orders } = o;
  return (
    <div className="flex flex-col gap-6">
      <FigureGrid label="What needs doing">
        <FigureLink to="/caseload?flag=new_setting_waiting" count={signOff.count} label={plural(signOff.count, 'setting waiting for sign-off', 'settings waiting for sign-off')}
          detail={oldest(signOff.oldestSince, o.asOf, 'Nothing waiting')} />
        <FigureLink to="/caseload?flag=check_overdue" count={overdueChecks.count} label={plural(overdueChecks.count, 'check overdue', 'checks overdue')} attention
          detail={overdueChecks.count ? `for ${overdueChecks.babies} ${plural(overdueChecks.babies, 'baby', 'babies')}` : 'All checks on time'} />
        <FigureLink to="/messages?status=failed" count={messages.failed} label={plural(messages.failed, 'message failed', 'messages failed')} attention
          detail={messages.unknown ? `and ${messages.unknown} not known to have arrived` : 'to families and staff'} />
        <FigureLink to="#journeys-waiting" count={journeysWaiting.count} label={plural(journeysWaiting.count, 'journey check waiting', 'journey checks waiting')}
          detail={oldest(journeysWaiting.oldestSince, o.asOf, 'Nothing waiting')} />
        <FigureLink to="#going-home" count={o.discharges.withDate} label={plural(o.discharges.withDate, 'baby with a discharge date', 'babies with a discharge date')}
          detail={`${o.discharges.preparing} more being prepared`} />
        <FigureLink to="/equipment-orders?status=open" count={orders.unconfirmed + orders.failed} attention
          label={plural(orders.unconfirmed + orders.failed, 'equipment order needs a look', 'equipment orders need a look')}
          detail={`${orders.unconfirmed} not confirmed by the date needed, ${orders.failed} failed to send`} />
      </FigureGrid>
      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Babies by status">
          <BabiesByStatus rows={o.babiesByStatus} />
        </Card>
        <JourneysWaiting o={o} />
        <DischargesCard discharges={o.discharges} />
        <OnOxygenCard months={o.onOxygenByMonth} />
      </div>
    </div>
  );
}

export function CoordinatorOverview() {
  return <OverviewLoadState query={useOverview('coordinator')}>{(o) => <CoordinatorFigures o={o} />}</OverviewLoadState>;
}
