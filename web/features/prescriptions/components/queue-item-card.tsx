import { Link } from 'react-router-dom';
import { PRESCRIPTION_REASON_LABELS, type QueueItem } from '@shared/schemas/prescriptions';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Badge } from '../../../components/ui/badge';
import { homePlaceText } from './home-place';
import { WaitingSince } from './waiting-since';

export const checksText = (count: number) => (count === 0 ? 'No points to check' : `${count} ${count === 1 ? 'point' : 'points'} to check`);
export const unmetText = (count: number) => (count === 0 ? 'Every step-down rule met' : `${count} step-down ${count === 1 ? 'rule' : 'rules'} not met`);
const STEP_REASONS: QueueItem['reason'][] = ['step_down'];

export function ProposedFlow({ item }: { item: Pick<QueueItem, 'feasible' | 'proposedFlowLpm'> }) {
  if (!item.feasible || item.proposedFlowLpm === null) {
    return <span className="font-bold text-danger-800">No setting reaches the target — decide</span>;
  }
  return <span className="font-bold tabular-nums text-ink-900">{formatFlow(item.proposedFlowLpm)} L/min</span>;
}

/** One waiting proposal: everything needed to pick what to open first, readable on a phone without a table. */
export function QueueItemCard({ item }: { item: QueueItem }) {
  return (
    <article aria-label={item.infantName} className="flex flex-col gap-2 rounded-xl border border-surface-200 bg-surface-0 p-4 shadow-sm">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
        <h2 className="text-lg font-bold text-ink-900">{item.infantName}</h2>
        <span className="text-ink-700">Corrected age {item.correctedAge}</span>
      </div>
      <div className="flex flex-wrap gap-2">
        <Badge tone="brand">{PRESCRIPTION_REASON_LABELS[item.reason]}</Badge>
        {STEP_REASONS.includes(item.reason) ? (
          <Badge tone={item.unmetChecks > 0 ? 'warn' : 'muted'}>
            {item.unmetChecks > 0 && <span aria-hidden="true">! </span>}
            {unmetText(item.unmetChecks)}
          </Badge>
        ) : (
          <Badge tone={item.warningCount > 0 ? 'warn' : 'muted'}>{checksText(item.warningCount)}</Badge>
        )}
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        <dt className="text-ink-500">Proposed</dt>
        <dd>
          <ProposedFlow item={item} />
        </dd>
        <dt className="text-ink-500">Home</dt>
        <dd className="text-ink-900">{homePlaceText(item.homeElevationM, item.homePressureMmHg)}</dd>
        <dt className="text-ink-500">Hospital</dt>
        <dd className="text-ink-900">{item.siteName}</dd>
        <dt className="text-ink-500">Waiting</dt>
        <dd>
          <WaitingSince iso={item.waitingSince} />
        </dd>
      </dl>
      <Link
        to={`/sign-off/${item.prescriptionId}`}
        aria-label={`Review proposal for ${item.infantName}`}
        className="mt-1 inline-flex min-h-11 items-center justify-center self-start rounded-lg bg-brand-600 px-4 font-semibold text-white hover:bg-brand-700"
      >
        Review proposal
      </Link>
    </article>
  );
}
