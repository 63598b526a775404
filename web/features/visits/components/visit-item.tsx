import { useState } from 'react';
import { mayMarkVisitDone, VISIT_KIND_LABELS, type Visit } from '@shared/schemas/visits';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import { useNow } from '../../../lib/use-now';
import { useCompleteVisit } from '../api/complete-visit';
import { CancelVisitForm } from './cancel-visit-form';
import { MoveVisitForm } from './move-visit-form';
import { visitLength, visitWhen } from './visit-words';

const STATUS_LABELS: Record<Visit['status'], string> = { booked: 'Booked', cancelled: 'Cancelled', done: 'Done' };

export function VisitItem({ visit, canManage }: { visit: Visit; canManage: boolean }) {
  const [editing, setEditing] = useState<'move' | 'cancel' | null>(null);
  const open = canManage && visit.status === 'booked';
  const now = useNow();
  const complete = useCompleteVisit(visit);
  const canComplete = open && mayMarkVisitDone(new Date(visit.startsAt), new Date(now));
  return (
    <li className="flex flex-col gap-2 px-3 py-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <span className="font-semibold text-ink-900">{visitWhen(visit)}</span>
        {visit.status !== 'booked' && <Badge>{STATUS_LABELS[visit.status]}</Badge>}
      </div>
      <p className="text-sm text-ink-700">
        {VISIT_KIND_LABELS[visit.kind]} · {visit.staff.name} · {visitLength(visit.durationMinutes)}
      </p>
      <p className="text-ink-900">{visit.purpose}</p>
      {visit.cancelReason && <p className="text-sm text-ink-700">Cancelled: {visit.cancelReason}</p>}
      {open && editing === null && (
        <div className="flex flex-wrap gap-2">
          {canComplete && (
            <Button size="sm" onClick={() => complete.mutate()} disabled={complete.isPending}>
              {complete.isPending ? 'Saving…' : 'Mark done'}
            </Button>
          )}
          <Button variant="secondary" size="sm" onClick={() => setEditing('move')}>Move</Button>
          <Button variant="quiet" size="sm" onClick={() => setEditing('cancel')}>Cancel the visit</Button>
        </div>
      )}
      {complete.isError && <Alert>{errorMessage(complete.error)}</Alert>}
      {open && editing === 'move' && <MoveVisitForm visit={visit} onClose={() => setEditing(null)} />}
      {open && editing === 'cancel' && <CancelVisitForm visit={visit} onClose={() => setEditing(null)} />}
    </li>
  );
}
