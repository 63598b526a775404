import { useMutation, useQueryClient } from '@tanstack/react-query';
import { prescriptionSchema, type DecisionInput } from '@shared/schemas/prescriptions';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { api } from '../../../lib/api-client';
import { isApiError } from '../../../lib/api-error';
import { prescriptionKeys } from './prescription-keys';

function describe(data: unknown, babyName: string): string {
  const rx = prescriptionSchema.parse(data);
  const who = babyName ? `${babyName}: version ${rx.version}` : `Version ${rx.version}`;
  if (rx.status === 'rejected') return `${who} was sent back.`;
  return rx.approvedFlowLpm === null ? `${who} approved.` : `${who} approved at ${formatFlow(rx.approvedFlowLpm)} L/min.`;
}

/** `babyName` only words the confirmation, so the consultant sees whose setting was just decided. */
export function useDecidePrescription(id: string, babyName = '') {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: DecisionInput) =>
      api.post(`/api/prescriptions/${encodeURIComponent(id)}/decision`, input, prescriptionSchema),
    // Field problems go beside the fields and a 409 has its own message on the page, so no toast repeats them.
    meta: { inlineErrors: ['validation_failed', 'conflict'], successToast: (data) => describe(data, babyName) },
    onSuccess: (rx) => {
      queryClient.setQueryData(prescriptionKeys.detail(id), rx);
      return queryClient.invalidateQueries({ queryKey: prescriptionKeys.all });
    },
    onError: (error) => {
      // Someone else decided it first: fetch what it is now instead of leaving a stale proposal on screen.
      if (isApiError(error) && error.status === 409) return queryClient.invalidateQueries({ queryKey: prescriptionKeys.all });
    },
  });
}
