import { useMutation } from '@tanstack/react-query';
import { prescriptionSchema, type Prescription } from '@shared/schemas/prescriptions';
import type { StepDownRequestInput } from '@shared/schemas/step-downs';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { api } from '../../../lib/api-client';

function describe(data: unknown): string {
  const rx = prescriptionSchema.parse(data);
  const flow = rx.proposedFlowLpm === null ? '' : rx.proposedFlowLpm === 0 ? ': off oxygen' : `: ${formatFlow(rx.proposedFlowLpm)} L/min`;
  return `Step down asked for (version ${rx.version}${flow}). It waits for a consultant’s sign-off.`;
}

/** The record refreshes its versions through `onRequested`; they belong to another feature's cache. */
export function useRequestStepDown(infantId: string, onRequested: (rx: Prescription) => void) {
  return useMutation({
    mutationFn: (input: StepDownRequestInput) =>
      api.post(`/api/infants/${encodeURIComponent(infantId)}/step-down-requests`, input, prescriptionSchema),
    // A 409 (a proposal already waits, or no oxygen to step down from) and field problems are shown in the form.
    meta: { inlineErrors: ['validation_failed', 'conflict', 'policy_not_met'], successToast: describe },
    onSuccess: onRequested,
  });
}
