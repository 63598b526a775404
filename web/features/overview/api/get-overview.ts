import { queryOptions, useQuery } from '@tanstack/react-query';
import { overviewSchema, type Overview } from '@shared/schemas/overview';
import { api } from '../../../lib/api-client';
import { overviewKeys } from './overview-keys';

export const overviewQueryOptions = () =>
  queryOptions({
    queryKey: overviewKeys.mine(),
    queryFn: ({ signal }) => api.get('/api/overview', overviewSchema, undefined, signal),
    // A start page left open through the day should keep its figures current.
    refetchInterval: 120_000,
  });

/** The caller's own role view; the page names the role it expects, so a wrong one is never drawn as another's. */
export function useOverview<R extends Overview['role']>(role: R) {
  return useQuery({ ...overviewQueryOptions(), select: (o) => (o.role === role ? (o as Extract<Overview, { role: R }>) : null) });
}
