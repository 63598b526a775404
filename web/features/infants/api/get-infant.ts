import { queryOptions, useQuery } from '@tanstack/react-query';
import { infantDetailSchema } from '@shared/schemas/infants';
import { api } from '../../../lib/api-client';
import { infantKeys } from './infant-keys';

const POLL_MS = 1500;

export const infantQueryOptions = (id: string) =>
  queryOptions({
    queryKey: infantKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(id)}`, infantDetailSchema, undefined, signal),
    // The worker moves a new baby on from 'preparing' within seconds; follow it only while that is pending.
    refetchInterval: (query) => (query.state.data?.status === 'preparing' ? POLL_MS : false),
  });

export const useInfant = (id: string) => useQuery(infantQueryOptions(id));
