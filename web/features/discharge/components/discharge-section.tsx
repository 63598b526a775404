import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { DISCHARGE_GROUPS, DISCHARGE_GROUP_LABELS } from '@shared/schemas/discharge-policy';
import type { Discharge } from '@shared/schemas/discharge';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { formatDate } from '../../../lib/format';
import { BookVisitForm } from '../../visits/components/book-visit-form';
import { useDischarge } from '../api/get-discharge';
import { dischargeKeys } from '../api/discharge-keys';
import { DischargeItemRow } from './discharge-item';
import { DischargeLetterActions } from './discharge-letter-actions';
import { SetDischargeForm } from './set-discharge-form';
import { missingLabel } from './discharge-words';

export interface DischargeRights { canChange: boolean; canOverride: boolean; canBookVisit: boolean }

function Progress({ d, closed }: { d: Discharge; closed: boolean }) {
  const done = d.items.filter((i) => i.done).length;
  return (
    <div className="flex flex-col gap-1">
      <p className="font-semibold text-ink-900">
        {d.dischargedOn
          ? `Discharge date: ${formatDate(d.dischargedOn)}`
          : closed ? 'No discharge date was set here' : d.ready ? 'Ready to go home: every step is done.' : 'Getting ready to go home'}
      </p>
      <label className="flex flex-wrap items-center gap-2 text-ink-700">
        {done} of {d.items.length} steps done
        <progress className="h-2 w-40" max={d.items.length} value={done} />
      </label>
      {!d.settingApproved && <p className="font-semibold text-warn-800">The home setting is not approved by a consultant yet.</p>}
      {d.override && (
        <p className="rounded-lg border border-warn-200 bg-warn-50 px-3 py-2 text-warn-800">
          Date set by {d.override.by?.name ?? 'a consultant'} before every step was done ({d.override.missing.map((k) => missingLabel(k, d.items)).join('; ')}).
          Reason: {d.override.reason}
        </p>
      )}
    </div>
  );
}

function FirstVisit({ infantId, d, canBook }: { infantId: string; d: Discharge; canBook: boolean }) {
  const [booking, setBooking] = useState(false);
  const queryClient = useQueryClient();
  if (!d.firstVisit) return null;
  const { proposedOn, bookedVisitId, visitOn } = d.firstVisit;
  const said = bookedVisitId && visitOn
      ? `First home visit booked for ${formatDate(visitOn)}${visitOn === proposedOn ? '' : ` (proposed for ${formatDate(proposedOn)})`}.`
      : `First home visit proposed for ${formatDate(proposedOn)}: not booked yet.`;
  const close = () => {
    setBooking(false);
    void queryClient.invalidateQueries({ queryKey: dischargeKeys.detail(infantId) });
  };
  return (
    <div className="flex flex-col gap-2 rounded-lg bg-surface-50 p-3">
      <p className="font-semibold text-ink-900">
        {said}
      </p>
      {!bookedVisitId && canBook && !booking && <div><Button variant="secondary" size="sm" onClick={() => setBooking(true)}>Book the first home visit</Button></div>}
      {booking && <BookVisitForm infantId={infantId} onClose={close} initial={{ kind: 'home_visit', date: proposedOn, purpose: 'First home visit after discharge' }} />}
    </div>
  );
}

/**
 * The discharge checklist on the baby's record: progress, the items by group, the date and the letter. `closed` once
 * the baby has left the programme: the checklist is then a record, as the API keeps it.
 */
export function DischargeSection({ infantId, rights, closed = false }: { infantId: string; rights: DischargeRights; closed?: boolean }) {
  const discharge = useDischarge(infantId);
  const [setting, setSetting] = useState(false);
  const d = discharge.data;
  const canChange = rights.canChange && !closed;
  const action = d && canChange && !setting
    ? <Button variant="secondary" size="sm" onClick={() => setSetting(true)}>{d.dischargedOn ? 'Change discharge date' : 'Set discharge date'}</Button>
    : undefined;
  return (
    <Card title="Discharge" actions={action}>
      {discharge.isPending && <Spinner label="Loading the discharge checklist" />}
      {discharge.isError && <Alert>{discharge.error.message}</Alert>}
      {d && (
        <div className="flex flex-col gap-4">
          <Progress d={d} closed={closed} />
          {closed && <p className="text-ink-700">This baby has left the programme: the checklist is closed and kept as it was.</p>}
          {setting && <SetDischargeForm infantId={infantId} discharge={d} canOverride={rights.canOverride} onClose={() => setSetting(false)} />}
          <FirstVisit infantId={infantId} d={d} canBook={rights.canBookVisit} />
          {DISCHARGE_GROUPS.map((group) => {
            const items = d.items.filter((i) => i.group === group);
            if (!items.length) return null;
            return (
              <section key={group} aria-labelledby={`discharge-${group}`}>
                <h3 id={`discharge-${group}`} className="mb-1 font-bold text-ink-900">
                  {DISCHARGE_GROUP_LABELS[group]} ({items.filter((i) => i.done).length} of {items.length})
                </h3>
                <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
                  {items.map((item) => <DischargeItemRow key={item.key} infantId={infantId} item={item} canChange={canChange} />)}
                </ul>
              </section>
            );
          })}
          <DischargeLetterActions infantId={infantId} canSend={rights.canChange} />
        </div>
      )}
    </Card>
  );
}
