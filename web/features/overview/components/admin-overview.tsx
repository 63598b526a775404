import { Link } from 'react-router-dom';
import { ROLE_LABELS } from '@shared/auth/roles';
import type { AdminOverview as Data } from '@shared/schemas/overview';
import { Card } from '../../../components/ui/card';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useOverview } from '../api/get-overview';
import { FigureGrid, FigureLink } from './figure-link';
import { OverviewLoadState } from './load-state';
import { OnOxygenCard } from './on-oxygen-card';
import { dayAndDate, longDate, plural } from './overview-format';

function PeopleByRole({ people }: { people: Data['people'] }) {
  return (
    <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
      {people.map((p) => (
        <li key={p.role}>
          <Link to={`/admin/people?role=${p.role}`} className="focus-inset flex items-baseline justify-between gap-3 px-3 py-2.5 hover:bg-brand-50">
            <span className="font-semibold text-brand-800 underline">{ROLE_LABELS[p.role]}</span>{' '}
            <span className="text-right">
              <span className={`text-2xl font-bold tabular-nums ${p.active ? 'text-ink-900' : 'text-ink-500'}`}>{p.active}</span>
              {p.disabled > 0 && <>{' '}<span className="block text-sm text-ink-700">and {p.disabled} disabled</span></>}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function AdminFigures({ o }: { o: Data }) {
  const { policy, messagesThisWeek: week } = o;
  const { programmeTimeZone: zone } = useSignedInUser();
  const active = o.people.reduce((sum, p) => sum + p.active, 0);
  const since = `since ${dayAndDate(week.since, zone)}`;
  return (
    <div className="flex flex-col gap-6">
      <FigureGrid label="The programme at a glance">
        <FigureLink to="/admin/people" count={active} label={plural(active, 'person can sign in', 'people can sign in')} detail="staff and family accounts" />
        <FigureLink to="/messages?status=sent" count={week.sent} label={plural(week.sent, 'message sent', 'messages sent')} detail={since} />
        <FigureLink to="/messages?status=failed" count={week.failed} label={plural(week.failed, 'message failed', 'messages failed')} attention
          detail={week.unknown ? `${since}; ${week.unknown} more not known to have arrived` : since} />
        <Link to="/admin/settings"
          className="group flex min-h-28 flex-col justify-between gap-1 rounded-2xl border border-l-8 border-surface-200 border-l-brand-200 bg-surface-0 p-4 shadow-sm hover:bg-brand-50">
          <span className="flex flex-wrap items-baseline gap-x-2">
            <span className="text-lg font-semibold text-brand-800 underline decoration-brand-300 underline-offset-4">Programme settings</span>{' '}
            <span className="whitespace-nowrap text-3xl font-bold tabular-nums text-ink-900 sm:text-4xl">{policy.version === 0 ? 'Defaults' : `Version ${policy.version}`}</span>
          </span>{' '}
          <span className="text-ink-700">{policy.savedAt ? `saved ${longDate(policy.savedAt, zone)}` : 'nobody has saved settings yet'}</span>
        </Link>
      </FigureGrid>
      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="People by role">
          <PeopleByRole people={o.people} />
        </Card>
        <OnOxygenCard months={o.onOxygenByMonth} />
      </div>
    </div>
  );
}

export function AdminOverview() {
  return <OverviewLoadState query={useOverview('admin')}>{(o) => <AdminFigures o={o} />}</OverviewLoadState>;
}
