import { queryOptions, useQuery } from '@tanstack/react-query';
import { savedMappingSchema } from '@shared/schemas/recordings';
import { api } from '../../../lib/api-client';
import { recordingKeys } from './recording-keys';

/** The mapping last used in this programme for a file with these column names (null when none). */
export const savedMappingQueryOptions = (infantId: string, found: readonly string[]) =>
  queryOptions({
    queryKey: recordingKeys.savedMapping(infantId, found),
    queryFn: ({ signal }) =>
      api.get(`/api/infants/${encodeURIComponent(infantId)}/recordings/saved-mapping`, savedMappingSchema, { headers: found.join('\n') }, signal),
    select: (answer) => answer.mapping,
    staleTime: 60_000,
  });

export const useSavedMapping = (infantId: string, found: readonly string[] | null) =>
  useQuery({ ...savedMappingQueryOptions(infantId, found ?? []), enabled: found !== null });
