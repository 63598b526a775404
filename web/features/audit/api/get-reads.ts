import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { usersPageSchema } from '@shared/schemas/users';
import { readLogPageSchema } from '@shared/schemas/audit';
import { api } from '../../../lib/api-client';
import { auditKeys, type ReadFilters } from './audit-keys';

/** Who looked at one baby's record, newest first; each further page continues from the last row shown (keyset). */
export const readsQueryOptions = (infantId: string, filters: ReadFilters) =>
  infiniteQueryOptions({
    queryKey: auditKeys.reads(infantId, filters),
    queryFn: ({ pageParam, signal }) =>
      api.get(`/api/infants/${encodeURIComponent(infantId)}/reads`, readLogPageSchema, { ...filters, cursor: pageParam ?? undefined }, signal),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
  });

export const useReads = (infantId: string, filters: ReadFilters) => useInfiniteQuery(readsQueryOptions(infantId, filters));

/** Everyone in the programme (staff and families), by name: the choices of the "person" filter. */
export const peopleQueryOptions = () =>
  queryOptions({
    queryKey: auditKeys.people(),
    queryFn: ({ signal }) => api.get('/api/users', usersPageSchema, { pageSize: 100, sort: 'name' }, signal),
    staleTime: 5 * 60_000,
  });
export const usePeople = () => useQuery(peopleQueryOptions());
