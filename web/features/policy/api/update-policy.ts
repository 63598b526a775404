import { useMutation, useQueryClient } from '@tanstack/react-query';
import { policySchema, type Policy, type UpdatePolicyInput } from '@shared/schemas/policy';
import { apiRequest } from '../../../lib/api-client';
import { policyKeys } from './policy-keys';

export function useUpdatePolicy() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdatePolicyInput) => apiRequest('/api/policy', { method: 'PUT', body: input, schema: policySchema }),
    // Field problems go beside the fields and a 409 has its own message with a reload, so no toast repeats them.
    meta: { inlineErrors: ['validation_failed', 'conflict'], successToast: (data) => `Saved as version ${(data as Policy).version}.` },
    onSuccess: (policy) => {
      queryClient.setQueryData(policyKeys.settings(), policy);
      return queryClient.invalidateQueries({ queryKey: policyKeys.all });
    },
  });
}
