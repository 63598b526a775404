import { useMutation, useQueryClient } from '@tanstack/react-query';
import { dischargeSchema, type SetDischargeInput } from '@shared/schemas/discharge';
import { api } from '../../../lib/api-client';
import { dischargeKeys } from './discharge-keys';

export function useSetDischargeDate(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SetDischargeInput) => api.post(`/api/infants/${encodeURIComponent(infantId)}/discharge`, input, dischargeSchema),
    meta: { inlineErrors: ['validation_failed', 'discharge_not_ready', 'forbidden', 'not_found'] },
    onSuccess: (data) => queryClient.setQueryData(dischargeKeys.detail(infantId), data),
  });
}
