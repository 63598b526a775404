import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { policySchema, policySettingsSchema } from '@shared/schemas/policy';
import { sitesResponseSchema } from '@shared/schemas/sites';
import { usersPageSchema } from '@shared/schemas/users';
import { api } from '../../../lib/api-client';
import { programmeKeys } from './infant-keys';

// Reference data changes rarely; five minutes keeps the form from refetching it on every step.
const REFERENCE_STALE_MS = 5 * 60_000;

export const sitesQueryOptions = () =>
  queryOptions({
    queryKey: programmeKeys.sites(),
    queryFn: ({ signal }) => api.get('/api/sites', sitesResponseSchema, undefined, signal),
    staleTime: REFERENCE_STALE_MS,
  });

// The preview needs only the conversion settings. Reading just those (with the shared field rules) keeps it working
// whichever policy sections a server version adds or has not added yet.
const conversionPolicySchema = z.object({
  version: policySchema.shape.version,
  settings: z.looseObject(
    policySettingsSchema.pick({ flowmeterStepsLpm: true, cannulaMaxFlowLpm: true, pressureModel: true }).shape,
  ),
});

export const policyQueryOptions = () =>
  queryOptions({
    queryKey: programmeKeys.policy(),
    queryFn: ({ signal }) => api.get('/api/policy', conversionPolicySchema, undefined, signal),
    staleTime: REFERENCE_STALE_MS,
  });

export const staffQueryOptions = (role: 'nurse' | 'consultant') =>
  queryOptions({
    queryKey: programmeKeys.staff(role),
    queryFn: ({ signal }) => api.get('/api/users', usersPageSchema, { role, pageSize: 100, sort: 'name' }, signal),
    staleTime: REFERENCE_STALE_MS,
    // A disabled account cannot take on a baby; the server refuses it too.
    select: (page) => page.items.filter((user) => !user.disabled),
  });

export const useSites = () => useQuery(sitesQueryOptions());
export const usePolicy = () => useQuery(policyQueryOptions());
export const useStaff = (role: 'nurse' | 'consultant') => useQuery(staffQueryOptions(role));
