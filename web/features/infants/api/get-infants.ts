import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { infantsPageSchema, type ListInfantsQuery } from '@shared/schemas/infants';
import { api } from '../../../lib/api-client';
import { infantKeys } from './infant-keys';

export const infantsQueryOptions = (query: ListInfantsQuery) =>
  queryOptions({
    queryKey: infantKeys.list(query),
    queryFn: ({ signal }) => api.get('/api/infants', infantsPageSchema, { ...query }, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useInfants = (query: ListInfantsQuery) => useQuery(infantsQueryOptions(query));
