import { queryOptions, useQuery } from '@tanstack/react-query';
import { journeyListSchema } from '@shared/schemas/journeys';
import { api } from '../../../lib/api-client';
import { journeyKeys } from './journey-keys';

export const waitingJourneysQueryOptions = () =>
  queryOptions({
    queryKey: journeyKeys.waiting(),
    queryFn: ({ signal }) => api.get('/api/journeys/waiting', journeyListSchema, undefined, signal),
    // Families ask at any time; an open sign-off page should notice new requests.
    refetchInterval: 60_000,
    select: (list) => list.items,
  });

export const useWaitingJourneys = () => useQuery(waitingJourneysQueryOptions());
