import { Link } from 'react-router-dom';
import { PRESCRIPTION_STATUS_LABELS, type Prescription } from '@shared/schemas/prescriptions';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Badge } from '../../../components/ui/badge';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';

const TONES = { preparing: 'muted', proposed: 'warn', active: 'ok', superseded: 'muted', rejected: 'danger', withdrawn: 'muted' } as const;

/** Shown instead of the decision controls once the proposal is no longer open for a decision. */
export function DecisionOutcome({ rx }: { rx: Prescription }) {
  if (rx.status === 'preparing') return <Spinner label="The setting is being worked out" />;
  return (
    <div className="flex flex-col gap-2">
      <p className="flex flex-wrap items-center gap-2">
        <span className="text-ink-700">Status:</span>
        <Badge tone={TONES[rx.status]}>{PRESCRIPTION_STATUS_LABELS[rx.status]}</Badge>
      </p>
      {rx.decidedAt && (
        <p className="text-ink-900">
          {rx.status === 'rejected' ? 'Sent back' : 'Decided'} by {rx.decidedBy?.name || 'a consultant'} on {formatDateTime(rx.decidedAt)}
          {rx.approvedFlowLpm !== null && <> at <span className="font-semibold">{formatFlow(rx.approvedFlowLpm)} L/min</span></>}.
        </p>
      )}
      {rx.decisionReason && <p className="text-ink-700">Reason: {rx.decisionReason}</p>}
      {rx.status === 'withdrawn' && <p className="text-ink-700">A newer proposal for this baby replaced this one.</p>}
      <Link to="/sign-off" className="font-semibold text-brand-700 underline">
        Back to the sign-off queue
      </Link>
    </div>
  );
}
