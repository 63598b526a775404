import { queryOptions, useQuery } from '@tanstack/react-query';
import { prescriptionListSchema } from '@shared/schemas/prescriptions';
import { api } from '../../../lib/api-client';
import { infantKeys } from './infant-keys';

const POLL_MS = 1500;

export const infantPrescriptionsQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: infantKeys.prescriptions(infantId),
    queryFn: ({ signal }) =>
      api.get(`/api/infants/${encodeURIComponent(infantId)}/prescriptions`, prescriptionListSchema, undefined, signal),
    // Poll only while the worker is computing a version, so the proposal appears without a reload and an idle
    // record costs nothing.
    refetchInterval: (query) => (query.state.data?.items.some((rx) => rx.status === 'preparing') ? POLL_MS : false),
  });

export const useInfantPrescriptions = (infantId: string) => useQuery(infantPrescriptionsQueryOptions(infantId));
