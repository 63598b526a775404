import { queryOptions } from '@tanstack/react-query';
import { policySchema, type Policy } from '@shared/schemas/policy';
import { api } from './api-client';

// Numbers to call and the cylinder list change rarely; ten minutes keeps pages from asking again on every visit.
const POLICY_READ_STALE_MS = 10 * 60_000;

// Under 'policy', so saving a new policy version refreshes every page that reads it.
export const programmePolicyKeys = { all: ['policy', 'programme-read'] as const };

/**
 * The programme's current settings, read-only, shared by every page that shows a part of them (one request, one
 * cache entry); each caller picks its part with `select`. The admin's editing form keeps its own query.
 */
export const programmePolicyQueryOptions = <T>(select: (policy: Policy) => T) =>
  queryOptions({
    queryKey: programmePolicyKeys.all,
    queryFn: ({ signal }) => api.get('/api/policy', policySchema, undefined, signal),
    staleTime: POLICY_READ_STALE_MS,
    select,
  });
