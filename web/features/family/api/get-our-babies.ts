import { queryOptions, useQuery } from '@tanstack/react-query';
import { infantsPageSchema } from '@shared/schemas/infants';
import { api } from '../../../lib/api-client';
import { familyKeys } from './family-keys';

// The server narrows the list to the family's own babies; a family rarely has more than two (twins).
export const ourBabiesQueryOptions = () =>
  queryOptions({
    queryKey: familyKeys.babies(),
    queryFn: ({ signal }) => api.get('/api/infants', infantsPageSchema, { pageSize: 100, sort: 'name' }, signal),
    select: (page) => page.items,
  });

export const useOurBabies = () => useQuery(ourBabiesQueryOptions());
