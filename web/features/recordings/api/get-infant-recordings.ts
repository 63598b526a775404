import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { recordingListSchema } from '@shared/schemas/recordings';
import { api } from '../../../lib/api-client';
import { isSettled } from './get-recording';
import { recordingKeys } from './recording-keys';

const POLL_MS = 3000;

export const infantRecordingsQueryOptions = (infantId: string, page: number, pageSize: number) =>
  queryOptions({
    queryKey: recordingKeys.list(infantId, page, pageSize),
    queryFn: ({ signal }) =>
      api.get(`/api/infants/${encodeURIComponent(infantId)}/recordings`, recordingListSchema, { page, pageSize }, signal),
    placeholderData: keepPreviousData,
    // A fresh upload shows its figures on the record as soon as the analysis is done.
    refetchInterval: (query) => (query.state.data?.items.some((r) => !isSettled(r)) ? POLL_MS : false),
  });

export const useInfantRecordings = (infantId: string, page: number, pageSize: number) =>
  useQuery(infantRecordingsQueryOptions(infantId, page, pageSize));
