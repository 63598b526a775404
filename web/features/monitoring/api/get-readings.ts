import { queryOptions, useQuery } from '@tanstack/react-query';
import { readingListSchema } from '@shared/schemas/readings';
import { api } from '../../../lib/api-client';
import { monitoringKeys } from './monitoring-keys';

export const infantReadingsQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: monitoringKeys.readings(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/readings`, readingListSchema, undefined, signal),
    // Readings are logged on other pages (the nurse's day, a family's phone): read them again whenever the record opens.
    staleTime: 0,
  });

export const useInfantReadings = (infantId: string) => useQuery(infantReadingsQueryOptions(infantId));
