import { useState } from 'react';
import { CHECK_KIND_LABELS, type Check } from '@shared/schemas/schedule';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useInfantSchedule } from '../api/get-schedule';
import { doneDayText, dueDayText } from './schedule-format';

const UPCOMING_SHOWN = 4;
const DONE_SHOWN = 5;

function CheckList({ title, checks, line }: { title: string; checks: Check[]; line: (check: Check) => string }) {
  return (
    <div className="flex flex-col gap-1">
      <h3 className="font-semibold text-ink-900">{title}</h3>
      <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
        {checks.map((check) => (
          <li key={check.id} className="flex flex-wrap items-baseline justify-between gap-x-3 px-3 py-2">
            <span className="font-semibold text-ink-900">{CHECK_KIND_LABELS[check.kind]}</span>
            <span className="text-sm text-ink-700">{line(check)}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Planned checks: overdue first (said in words), then what is coming, then what was done lately. */
export function ScheduleSection({ infantId }: { infantId: string }) {
  const schedule = useInfantSchedule(infantId);
  const [allUpcoming, setAllUpcoming] = useState(false);
  const data = schedule.data;
  const upcoming = data ? (allUpcoming ? data.upcoming : data.upcoming.slice(0, UPCOMING_SHOWN)) : [];
  const done = data ? [...data.done].sort((a, b) => (b.doneAt ?? '').localeCompare(a.doneAt ?? '')).slice(0, DONE_SHOWN) : [];
  return (
    <Card title="Schedule">
      {schedule.isPending && <Spinner label="Loading the schedule" />}
      {schedule.isError && <Alert>{schedule.error.message}</Alert>}
      {data && data.overdue.length + data.upcoming.length + data.done.length === 0 && <EmptyState message="No checks planned." />}
      {data && (
        <div className="flex flex-col gap-4">
          {data.overdue.length > 0 && (
            <div className="rounded-xl border border-warn-200 border-l-8 border-l-warn-600 bg-warn-50 p-2">
              <CheckList title={`Overdue (${data.overdue.length})`} checks={data.overdue}
                line={(check) => `overdue since ${dueDayText(check.dueDate)}`} />
            </div>
          )}
          {data.upcoming.length > 0 && (
            <div className="flex flex-col gap-2">
              <CheckList title="Coming up" checks={upcoming} line={(check) => `due ${dueDayText(check.dueDate)}`} />
              {data.upcoming.length > UPCOMING_SHOWN && (
                <div>
                  <Button variant="quiet" size="sm" aria-expanded={allUpcoming} onClick={() => setAllUpcoming((all) => !all)}>
                    {allUpcoming ? 'Show fewer' : `Show all ${data.upcoming.length} planned checks`}
                  </Button>
                </div>
              )}
            </div>
          )}
          {done.length > 0 && (
            <CheckList title="Recently done" checks={done} line={(check) => (check.doneAt ? `done ${doneDayText(check.doneAt)}` : 'done')} />
          )}
        </div>
      )}
    </Card>
  );
}
