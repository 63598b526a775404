import { queryOptions, useQuery } from '@tanstack/react-query';
import { queueSchema } from '@shared/schemas/prescriptions';
import { api } from '../../../lib/api-client';
import { prescriptionKeys } from './prescription-keys';

export const signOffQueueQueryOptions = () =>
  queryOptions({
    queryKey: prescriptionKeys.queue(),
    queryFn: ({ signal }) => api.get('/api/prescriptions/queue', queueSchema, undefined, signal),
    // New proposals arrive from the worker at any time; a consultant's open queue should notice them.
    refetchInterval: 60_000,
  });

export const useSignOffQueue = () => useQuery(signOffQueueQueryOptions());
