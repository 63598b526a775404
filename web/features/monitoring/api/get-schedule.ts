import { queryOptions, useQuery } from '@tanstack/react-query';
import { scheduleResponseSchema } from '@shared/schemas/schedule';
import { api } from '../../../lib/api-client';
import { monitoringKeys } from './monitoring-keys';

export const infantScheduleQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: monitoringKeys.schedule(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/schedule`, scheduleResponseSchema, undefined, signal),
    // A reading or a recording saved elsewhere completes a check; the record must not show it as still due.
    staleTime: 0,
  });

export const useInfantSchedule = (infantId: string) => useQuery(infantScheduleQueryOptions(infantId));
