import { queryOptions, useQuery } from '@tanstack/react-query';
import { journeyListSchema } from '@shared/schemas/journeys';
import { api } from '../../../lib/api-client';
import { journeyKeys } from './journey-keys';

/** A baby's journey checks; the server gives a family its own baby's only, with the numbers once approved. */
export const infantJourneysQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: journeyKeys.list(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/journeys`, journeyListSchema, undefined, signal),
    select: (list) => list.items,
  });

export const useInfantJourneys = (infantId: string | undefined) =>
  useQuery({ ...infantJourneysQueryOptions(infantId ?? ''), enabled: Boolean(infantId) });
