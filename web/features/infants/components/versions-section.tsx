import {
  PRESCRIPTION_REASON_LABELS,
  PRESCRIPTION_STATUS_LABELS,
  type Prescription,
  type PrescriptionStatus,
} from '@shared/schemas/prescriptions';
import { WorkingTable } from '../../../components/clinical/working-table';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { formatDateTime } from '../../../lib/format';
import { flowText } from './record-format';

type Tone = Parameters<typeof Badge>[0]['tone'];
const STATUS_TONES: Record<PrescriptionStatus, Tone> = {
  preparing: 'muted',
  proposed: 'brand',
  active: 'ok',
  superseded: 'muted',
  rejected: 'danger',
  withdrawn: 'muted',
};

function VersionItem({ rx }: { rx: Prescription }) {
  const decided = rx.decidedAt ? `${rx.decidedBy?.name ?? 'Someone'}, ${formatDateTime(rx.decidedAt)}` : 'Not yet';
  return (
    <li className="flex flex-col gap-2 rounded-xl border border-surface-200 p-3 sm:p-4">
      <div className="flex flex-wrap items-center gap-2">
        <h3 className="font-bold text-ink-900">Version {rx.version}</h3>
        <Badge tone={STATUS_TONES[rx.status]}>{PRESCRIPTION_STATUS_LABELS[rx.status]}</Badge>
        <span className="text-sm text-ink-700">{PRESCRIPTION_REASON_LABELS[rx.reason]}</span>
      </div>
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[10rem_1fr]">
        <dt className="text-ink-500">Proposed flow</dt>
        <dd className="text-ink-900">{rx.status === 'preparing' ? 'Being worked out' : flowText(rx.proposedFlowLpm)}</dd>
        <dt className="text-ink-500">Approved flow</dt>
        <dd className="text-ink-900">{flowText(rx.approvedFlowLpm)}</dd>
        <dt className="text-ink-500">Decided by</dt>
        <dd className="text-ink-900">{decided}</dd>
        {rx.decisionReason && (
          <>
            <dt className="text-ink-500">Reason given</dt>
            <dd className="text-ink-900">{rx.decisionReason}</dd>
          </>
        )}
        <dt className="text-ink-500">Asked for</dt>
        <dd className="text-ink-900">{formatDateTime(rx.createdAt)}</dd>
      </dl>
      {rx.conversion && (
        <details className="rounded-lg border border-surface-200">
          <summary className="min-h-11 cursor-pointer px-3 py-2.5 font-semibold text-brand-700">
            Show the working for version {rx.version}
          </summary>
          <div className="border-t border-surface-200 p-2">
            <WorkingTable working={rx.conversion.working} warnings={rx.conversion.warnings} model={rx.conversion.model} />
          </div>
        </details>
      )}
    </li>
  );
}

export function VersionsSection({ versions }: { versions: Prescription[] }) {
  return (
    <Card title="Versions">
      {versions.length === 0 ? (
        <EmptyState message="No versions yet." />
      ) : (
        <ol className="flex flex-col gap-3">
          {versions.map((rx) => (
            <VersionItem key={rx.id} rx={rx} />
          ))}
        </ol>
      )}
    </Card>
  );
}
