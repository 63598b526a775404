import { queryOptions, useQuery } from '@tanstack/react-query';
import { journeyResponseSchema } from '@shared/schemas/journeys';
import { api } from '../../../lib/api-client';
import { journeyKeys } from './journey-keys';

export const journeyQueryOptions = (id: string) =>
  queryOptions({
    queryKey: journeyKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/journeys/${encodeURIComponent(id)}`, journeyResponseSchema, undefined, signal),
    select: (response) => response.journey,
  });

export const useJourney = (id: string) => useQuery(journeyQueryOptions(id));
