import { queryOptions, useQuery } from '@tanstack/react-query';
import { prescriptionSchema } from '@shared/schemas/prescriptions';
import { api } from '../../../lib/api-client';
import { prescriptionKeys } from './prescription-keys';

const PREPARING_POLL_MS = 1500;

export const prescriptionQueryOptions = (id: string) =>
  queryOptions({
    queryKey: prescriptionKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/prescriptions/${encodeURIComponent(id)}`, prescriptionSchema, undefined, signal),
    // The worker turns 'preparing' into 'proposed' within seconds; poll only while that is pending.
    refetchInterval: (query) => (query.state.data?.status === 'preparing' ? PREPARING_POLL_MS : false),
  });

export const usePrescription = (id: string) => useQuery(prescriptionQueryOptions(id));
