import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { endLocalSession } from './end-local-session';

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete('/api/session'),
    onSuccess: () => endLocalSession(queryClient, 'signed-out'),
  });
}
