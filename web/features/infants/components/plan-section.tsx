import { asksForNoOxygen } from '@shared/equipment/concentrator-fit';
import { Link } from 'react-router-dom';
import { infeasibleReason } from '@shared/clinical/conversion-warnings';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Prescription } from '@shared/schemas/prescriptions';
import { CarePlanLink } from '../../../components/clinical/care-plan-link';
import { Cautions } from '../../../components/clinical/cautions';
import { formatFraction } from '../../../components/clinical/clinical-format';
import { settingText } from '../../../components/clinical/setting-text';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { flowText } from './record-format';

function ProposalPanel({ rx }: { rx: Prescription }) {
  const conversion = rx.conversion;
  return (
    <div className="flex flex-col gap-2 rounded-xl border border-brand-200 bg-brand-50 p-3 sm:p-4">
      <div className="flex flex-wrap items-center gap-2">
        <h3 className="font-bold text-brand-800">Waiting for consultant sign-off</h3>
        <Badge tone="brand">Proposal, not approved</Badge>
      </div>
      {rx.proposedFlowLpm !== null ? (
        <p className="text-ink-900">
          Proposed: <span className="text-lg font-bold">{flowText(rx.proposedFlowLpm)}</span>
          {rx.requiredFlowLpm !== null && <> (needs {rx.requiredFlowLpm.toFixed(3)} L/min, rounded up to the flowmeter step)</>}
          {conversion?.home.deliveredFio2 != null && <>, giving FiO2 {formatFraction(conversion.home.deliveredFio2)}</>}
        </p>
      ) : (
        <p className="font-semibold text-ink-900">{infeasibleReason(conversion?.warnings ?? [])} The consultant must decide.</p>
      )}
      <p className="text-sm text-ink-700">Version {rx.version}. Not to be used until a consultant approves it.</p>
    </div>
  );
}

interface PlanSectionProps {
  infant: InfantDetail;
  prescriptions: { data?: Prescription[]; isPending: boolean; error: Error | null };
}

export function PlanSection({ infant, prescriptions }: PlanSectionProps) {
  const setting = infant.activeSetting;
  const versions = prescriptions.data ?? [];
  const preparing = versions.find((rx) => rx.status === 'preparing');
  const proposed = versions.find((rx) => rx.status === 'proposed');
  const latest = versions[0];
  return (
    <Card title="Plan" actions={setting ? <CarePlanLink infantId={infant.id} size="small" /> : undefined}>
      <div className="flex flex-col gap-4">
        {setting ? (
          <div>
            <p className="text-sm font-semibold text-ok-800">Current plan, approved</p>
            <p className="text-xl font-bold text-ink-900">{settingText(setting)}</p>
            <p className="text-sm text-ink-700">
              Version {setting.version}
              {setting.effectiveFio2 !== null && <> · effective FiO2 {formatFraction(setting.effectiveFio2)}</>}
              {setting.approvedAt && <> · approved {formatDateTime(setting.approvedAt)}</>}
            </p>
          </div>
        ) : (
          <p className="text-ink-700">No approved setting yet. The family sees a plan only after a consultant approves one.</p>
        )}
        {prescriptions.isPending && <Spinner label="Loading versions" />}
        {prescriptions.error && <Alert>{prescriptions.error.message}</Alert>}
        {preparing && (
          <p className="flex items-center gap-2 rounded-xl border border-surface-200 bg-surface-50 p-3 font-semibold text-ink-900">
            <Spinner label="Working out the home setting" />
          </p>
        )}
        {proposed && <ProposalPanel rx={proposed} />}
        {latest?.status === 'rejected' && (
          <Alert tone="warn">
            Version {latest.version} was sent back{latest.decidedBy ? ` by ${latest.decidedBy.name}` : ''}
            {latest.decisionReason ? `: ${latest.decisionReason}` : '.'}
          </Alert>
        )}
        {/* A cylinder's time is a question only while oxygen flows. */}
        {setting && !asksForNoOxygen(setting.flowLpm, setting.periods ?? null) && (
          <Link to={`/infants/${infant.id}/cylinder`} className="self-start font-semibold text-brand-700 underline">
            How long will a cylinder last?
          </Link>
        )}
        <Cautions variant="staff" />
      </div>
    </Card>
  );
}
