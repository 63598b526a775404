import { queryOptions, useQuery } from '@tanstack/react-query';
import { recordingSchema, recordingTraceSchema, type Recording } from '@shared/schemas/recordings';
import { api } from '../../../lib/api-client';
import { recordingKeys } from './recording-keys';

const POLL_MS = 2000;

export const isSettled = (recording: Pick<Recording, 'status'>) => recording.status === 'done' || recording.status === 'failed';

export const recordingQueryOptions = (id: string) =>
  queryOptions({
    queryKey: recordingKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/recordings/${encodeURIComponent(id)}`, recordingSchema, undefined, signal),
    // The worker analyses a night in seconds; follow it only until it is done or has failed.
    refetchInterval: (query) => (query.state.data && !isSettled(query.state.data) ? POLL_MS : false),
  });

/** The trace exists only once the analysis is done; a done analysis never changes, so it is read once. */
export const recordingTraceQueryOptions = (id: string) =>
  queryOptions({
    queryKey: recordingKeys.trace(id),
    queryFn: ({ signal }) => api.get(`/api/recordings/${encodeURIComponent(id)}/trace`, recordingTraceSchema, undefined, signal),
    staleTime: Infinity,
  });

export const useRecording = (id: string) => useQuery(recordingQueryOptions(id));
export const useRecordingTrace = (id: string, enabled: boolean) => useQuery({ ...recordingTraceQueryOptions(id), enabled });
