import { queryOptions, useQuery } from '@tanstack/react-query';
import { dischargeSchema } from '@shared/schemas/discharge';
import { api } from '../../../lib/api-client';
import { dischargeKeys } from './discharge-keys';

export const dischargeQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: dischargeKeys.detail(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/discharge`, dischargeSchema, undefined, signal),
  });

export const useDischarge = (infantId: string) => useQuery(dischargeQueryOptions(infantId));
