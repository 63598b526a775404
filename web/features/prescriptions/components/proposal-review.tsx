import { InPageLink } from '../../../components/ui/in-page-link';
import type { InfantDetail } from '@shared/schemas/infants';
import { PRESCRIPTION_REASON_LABELS, type Prescription } from '@shared/schemas/prescriptions';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Cautions } from '../../../components/clinical/cautions';
import { WorkingTable } from '../../../components/clinical/working-table';
import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-error';
import type { useDecidePrescription } from '../api/decide-prescription';
import { DecisionForm } from './decision-form';
import { DecisionOutcome } from './decision-outcome';
import { ProposalFigures } from './proposal-figures';
import { ReviewHeader } from './review-header';
import { readStepDownEvidence, StepDownEvidencePanel } from '../../step-downs/components/step-down-evidence';

export const ALREADY_DECIDED = 'Someone has already decided this proposal.';

interface ProposalReviewProps {
  rx: Prescription;
  infant: InfantDetail;
  /** Null while the programme's flowmeter steps are loading. */
  steps: readonly number[] | null;
  /** Why the steps could not be loaded, if they could not. */
  stepsProblem?: string;
  mutation: ReturnType<typeof useDecidePrescription>;
  onDecided: () => void;
}

function ProposalBanner({ open }: { open: boolean }) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-2 rounded-lg border-2 border-dashed border-warn-600 bg-warn-50 px-3 py-2">
      <p className="font-bold text-warn-800">PROPOSAL — not approved. The family does not see it until a consultant approves it.</p>
      {open && (
        <InPageLink target="decision">Go to the decision</InPageLink>
      )}
    </div>
  );
}

export function ProposalReview({ rx, infant, steps, stepsProblem, mutation, onDecided }: ProposalReviewProps) {
  const conflict = isApiError(mutation.error) && mutation.error.status === 409;
  const open = rx.status === 'proposed';
  const pending = open || rx.status === 'preparing';
  const stepEvidence = rx.reason === 'step_down' ? readStepDownEvidence(rx.evidence) : null;
  return (
    <div className="flex flex-col gap-4">
      <ReviewHeader infant={infant} />
      <Card title={`${pending ? 'Proposed home setting' : 'Home setting'} · version ${rx.version}`}>
        <div className="flex flex-col gap-3">
          {pending && <ProposalBanner open={open} />}
          {rx.conversion ? (
            <ProposalFigures rx={rx} conversion={rx.conversion} hospital={infant.hospital} />
          ) : rx.status === 'preparing' ? (
            <Spinner label="The setting is being worked out" />
          ) : (
            <p className="text-ink-900">
              {PRESCRIPTION_REASON_LABELS[rx.reason]}: proposed flow{' '}
              <span className="font-bold">{rx.proposedFlowLpm === null ? 'none' : `${formatFlow(rx.proposedFlowLpm)} L/min`}</span>
            </p>
          )}
        </div>
      </Card>
      {stepEvidence && <StepDownEvidencePanel evidence={stepEvidence} infantId={rx.infantId} />}
      {rx.conversion && (
        <Card title="Checks and working">
          <WorkingTable working={rx.conversion.working} warnings={rx.conversion.warnings} model={rx.conversion.model} />
        </Card>
      )}
      <Cautions variant="staff" />
      <Card title="Decision">
        <div id="decision" className="flex scroll-mt-4 flex-col gap-4">
          {conflict && <Alert>{ALREADY_DECIDED}</Alert>}
          {open && steps ? (
            <DecisionForm rx={rx} steps={steps} mutation={mutation} onDecided={onDecided} />
          ) : open && stepsProblem ? (
            <Alert>The programme's flowmeter steps could not be loaded, so no decision can be recorded yet. {stepsProblem}</Alert>
          ) : open ? (
            <Spinner label="Loading the flowmeter steps" />
          ) : (
            <DecisionOutcome rx={rx} />
          )}
        </div>
      </Card>
    </div>
  );
}
