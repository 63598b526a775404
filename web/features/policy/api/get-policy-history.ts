import { queryOptions, useQuery } from '@tanstack/react-query';
import { policyHistorySchema, type PolicyHistory } from '@shared/schemas/policy';
import { api } from '../../../lib/api-client';
import { policyKeys } from './policy-keys';

export type PolicyVersionRow = PolicyHistory['items'][number];

export const policyHistoryQueryOptions = () =>
  queryOptions({
    queryKey: policyKeys.history(),
    queryFn: ({ signal }) => api.get('/api/policy/history', policyHistorySchema, undefined, signal),
    select: (data) => [...data.items].sort((a, b) => b.version - a.version),
  });

export const usePolicyHistory = () => useQuery(policyHistoryQueryOptions());
