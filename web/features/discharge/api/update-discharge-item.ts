import { useMutation, useQueryClient } from '@tanstack/react-query';
import { dischargeItemSchema, type UpdateDischargeItemInput } from '@shared/schemas/discharge';
import { apiRequest } from '../../../lib/api-client';
import { dischargeKeys } from './discharge-keys';

export function useUpdateDischargeItem(infantId: string, key: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateDischargeItemInput) =>
      apiRequest(`/api/infants/${encodeURIComponent(infantId)}/discharge/items/${encodeURIComponent(key)}`, { method: 'PUT', body: input, schema: dischargeItemSchema }),
    meta: { inlineErrors: ['validation_failed', 'forbidden', 'not_found'] },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: dischargeKeys.detail(infantId) }),
  });
}
