import { queryOptions, useQuery } from '@tanstack/react-query';
import { readingListSchema } from '@shared/schemas/readings';
import { api } from '../../../lib/api-client';
import { readingKeys } from './reading-keys';

/**
 * One reading, usually put in the cache by the save or the correction that returned it. There is no endpoint for a
 * single reading, so a cold cache reads the baby's recent readings and picks it out.
 */
export const readingQueryOptions = (infantId: string, readingId: string) =>
  queryOptions({
    queryKey: readingKeys.detail(infantId, readingId),
    queryFn: async ({ signal }) => {
      const list = await api.get(`/api/infants/${encodeURIComponent(infantId)}/readings`, readingListSchema, undefined, signal);
      const found = list.items.find((reading) => reading.id === readingId);
      if (!found) throw new Error('This reading is no longer in the recent readings.');
      return found;
    },
    // Every change to a reading comes back from our own PATCH and is written into the cache there.
    staleTime: Infinity,
  });

export const useReading = (infantId: string, readingId: string) => useQuery(readingQueryOptions(infantId, readingId));
