import { useMutation, useQueryClient } from '@tanstack/react-query';
import { infantDetailSchema, type EnrolInfantInput } from '@shared/schemas/infants';
import { api } from '../../../lib/api-client';
import { infantKeys } from './infant-keys';

export function useEnrolInfant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EnrolInfantInput) => api.post('/api/infants', input, infantDetailSchema),
    meta: { inlineErrors: ['validation_failed'], successToast: () => 'Baby enrolled. The home setting is being worked out.' },
    onSuccess: (infant) => {
      queryClient.setQueryData(infantKeys.detail(infant.id), infant);
      return queryClient.invalidateQueries({ queryKey: infantKeys.lists() });
    },
  });
}
