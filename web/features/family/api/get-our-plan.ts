import { queryOptions, useQuery } from '@tanstack/react-query';
import { prescriptionListSchema } from '@shared/schemas/prescriptions';
import { api } from '../../../lib/api-client';
import { familyKeys } from './family-keys';

export const ourPlanQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: familyKeys.plan(infantId),
    queryFn: ({ signal }) =>
      api.get(`/api/infants/${encodeURIComponent(infantId)}/prescriptions`, prescriptionListSchema, undefined, signal),
    // The server only sends a family the approved plan; filtering again means a proposal can never be shown here.
    select: (list) => list.items.find((rx) => rx.status === 'active' && rx.approvedFlowLpm !== null) ?? null,
  });

export const useOurPlan = (infantId: string) => useQuery({ ...ourPlanQueryOptions(infantId), enabled: infantId !== '' });
