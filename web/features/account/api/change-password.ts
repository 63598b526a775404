import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@shared/schemas/accounts';
import { apiRequest } from '../../../lib/api-client';

export function useChangePassword() {
  return useMutation({
    mutationFn: (input: ChangePasswordInput) => apiRequest('/api/me/password', { method: 'PUT', body: input }),
    meta: { inlineErrors: ['validation_failed', 'rate_limited'], successToast: () => 'Password changed. You stay signed in here; other devices are signed out.' },
  });
}
