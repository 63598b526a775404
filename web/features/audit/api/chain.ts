import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { chainCheckSchema, chainChecksSchema } from '@shared/schemas/audit';
import { api } from '../../../lib/api-client';
import { auditKeys } from './audit-keys';

export const chainChecksQueryOptions = () =>
  queryOptions({
    queryKey: auditKeys.chainChecks(),
    queryFn: ({ signal }) => api.get('/api/audit/chain/checks', chainChecksSchema, undefined, signal),
  });

export const useChainChecks = () => useQuery(chainChecksQueryOptions());

/** Admin: walk the programme's audit hash chain now; the result is kept and listed with the nightly ones. */
export function useVerifyChain() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/audit/chain/verify', undefined, chainCheckSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: auditKeys.chainChecks() }),
  });
}
