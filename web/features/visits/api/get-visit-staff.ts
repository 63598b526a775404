import { queryOptions, useQueries } from '@tanstack/react-query';
import { usersPageSchema, type User } from '@shared/schemas/users';
import { api } from '../../../lib/api-client';
import { visitKeys, type StaffRole } from './visit-keys';

const ROLES: StaffRole[] = ['nurse', 'coordinator', 'consultant'];

export const visitStaffQueryOptions = (role: StaffRole) =>
  queryOptions({
    queryKey: visitKeys.staff(role),
    queryFn: ({ signal }) => api.get('/api/users', usersPageSchema, { role, pageSize: 100, sort: 'name' }, signal),
    // The team changes rarely; the booking form should not refetch it on every open.
    staleTime: 5 * 60_000,
  });

/** Everyone who can see a family: nurses, coordinators and consultants, by name. Disabled accounts cannot. */
export function useVisitStaff() {
  return useQueries({
    queries: ROLES.map(visitStaffQueryOptions),
    combine: (results) => ({
      isPending: results.some((r) => r.isPending),
      staff: results
        .flatMap((r) => r.data?.items ?? [])
        .filter((user: User) => !user.disabled)
        .sort((a, b) => a.name.localeCompare(b.name)),
    }),
  });
}
