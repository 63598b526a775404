import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { usersPageSchema, type ListUsersQuery } from '@shared/schemas/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './user-keys';

export const usersQueryOptions = (query: ListUsersQuery) =>
  queryOptions({
    queryKey: userKeys.list(query),
    queryFn: ({ signal }) => api.get('/api/users', usersPageSchema, { ...query }, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useUsers = (query: ListUsersQuery) => useQuery(usersQueryOptions(query));
