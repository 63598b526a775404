import { queryOptions, useQuery } from '@tanstack/react-query';
import { preferencesResponseSchema } from '@shared/schemas/preferences';
import { api } from '../../../lib/api-client';
import { preferenceKeys } from './preference-keys';

export const myPreferencesQueryOptions = () =>
  queryOptions({
    queryKey: preferenceKeys.mine(),
    queryFn: ({ signal }) => api.get('/api/me/preferences', preferencesResponseSchema, undefined, signal),
    // A background refresh would restart the form under the family's fingers; a stale version is caught by the 409.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useMyPreferences = () => useQuery(myPreferencesQueryOptions());
