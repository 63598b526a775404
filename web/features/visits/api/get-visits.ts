import { queryOptions, useQuery } from '@tanstack/react-query';
import { visitListSchema } from '@shared/schemas/visits';
import { api } from '../../../lib/api-client';
import { visitKeys } from './visit-keys';

export const infantVisitsQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: visitKeys.list(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/visits`, visitListSchema, undefined, signal),
  });

export const useInfantVisits = (infantId: string | undefined) =>
  useQuery({ ...infantVisitsQueryOptions(infantId ?? ''), enabled: Boolean(infantId) });
