import { queryOptions, useQuery } from '@tanstack/react-query';
import { setupLinkInfoSchema } from '@shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { accountKeys } from './account-keys';

/** Who a set-up link is for; a POST so the secret never sits in a URL the server logs. */
export const setupLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: accountKeys.setupLink(token),
    queryFn: () => api.post('/api/account/set-password/check', { token }, setupLinkInfoSchema, { redirectOn401: false }),
    retry: false,
    staleTime: Infinity,
  });

export const useSetupLink = (token: string) => useQuery({ ...setupLinkQueryOptions(token), enabled: token.length > 0 });
