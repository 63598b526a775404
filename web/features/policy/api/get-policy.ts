import { queryOptions, useQuery } from '@tanstack/react-query';
import { policySchema } from '@shared/schemas/policy';
import { api } from '../../../lib/api-client';
import { policyKeys } from './policy-keys';

export const policyQueryOptions = () =>
  queryOptions({
    queryKey: policyKeys.settings(),
    queryFn: ({ signal }) => api.get('/api/policy', policySchema, undefined, signal),
    // A background refresh would restart the form under the admin's hands; a stale base is caught by the 409.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const usePolicy = () => useQuery(policyQueryOptions());
