import { queryOptions, useQuery } from '@tanstack/react-query';
import { policySchema } from '../../../../shared/schemas/policy';
import { api } from '../../../lib/api-client';
import { familyKeys } from './family-keys';

// Phone numbers change rarely; ten minutes keeps the page from asking again on every visit.
const CONTACTS_STALE_MS = 10 * 60_000;

/** Who the family calls: the programme's numbers and the local emergency number, from the current policy. */
export const programmeContactsQueryOptions = () =>
  queryOptions({
    queryKey: familyKeys.contacts(),
    queryFn: ({ signal }) => api.get('/api/policy', policySchema, undefined, signal),
    staleTime: CONTACTS_STALE_MS,
    select: (policy) => policy.settings.contacts,
  });

export const useProgrammeContacts = () => useQuery(programmeContactsQueryOptions());
