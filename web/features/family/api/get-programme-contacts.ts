import { useQuery } from '@tanstack/react-query';
import { programmePolicyQueryOptions } from '../../../lib/programme-policy';

/** Who the family calls: the programme's numbers and the local emergency number, from the current policy. */
export const programmeContactsQueryOptions = () => programmePolicyQueryOptions((policy) => policy.settings.contacts);

export const useProgrammeContacts = () => useQuery(programmeContactsQueryOptions());
