import { queryOptions, useQuery } from '@tanstack/react-query';
import { policySchema } from '../../../../shared/schemas/policy';
import { api } from '../../../lib/api-client';
import { cylinderKeys } from './cylinder-keys';

// The supplier's cylinders change rarely; ten minutes keeps the page from asking again on every visit.
const SUPPLY_STALE_MS = 10 * 60_000;

/** The programme's cylinders and reserve, from the current policy. */
export const cylinderSupplyQueryOptions = () =>
  queryOptions({
    queryKey: cylinderKeys.supply(),
    queryFn: ({ signal }) => api.get('/api/policy', policySchema, undefined, signal),
    staleTime: SUPPLY_STALE_MS,
    select: (policy) => policy.settings.supply,
  });

export const useCylinderSupply = () => useQuery(cylinderSupplyQueryOptions());
