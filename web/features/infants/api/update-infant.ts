import { useMutation, useQueryClient } from '@tanstack/react-query';
import { infantDetailSchema, type ContactInput, type UpdateInfantInput } from '@shared/schemas/infants';
import { apiRequest } from '../../../lib/api-client';
import { infantKeys } from './infant-keys';

export function useUpdateInfant(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateInfantInput) =>
      apiRequest(`/api/infants/${encodeURIComponent(id)}`, { method: 'PATCH', body: input, schema: infantDetailSchema }),
    meta: { inlineErrors: ['validation_failed', 'conflict'] },
    onSuccess: (infant) => {
      queryClient.setQueryData(infantKeys.detail(id), infant);
      // A weight or home change opens a new version; the list and history must show it.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: infantKeys.prescriptions(id) }),
        queryClient.invalidateQueries({ queryKey: infantKeys.audit(id) }),
        queryClient.invalidateQueries({ queryKey: infantKeys.lists() }),
      ]);
    },
  });
}

export function useReplaceContacts(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (contacts: ContactInput[]) =>
      apiRequest(`/api/infants/${encodeURIComponent(id)}/contacts`, { method: 'PUT', body: { contacts }, schema: infantDetailSchema }),
    meta: { inlineErrors: ['validation_failed'], successToast: () => 'Family contacts saved.' },
    onSuccess: (infant) => {
      queryClient.setQueryData(infantKeys.detail(id), infant);
      return queryClient.invalidateQueries({ queryKey: infantKeys.audit(id) });
    },
  });
}
