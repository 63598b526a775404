import { queryOptions, useQuery } from '@tanstack/react-query';
import { healthSchema } from '@shared/schemas/health';
import { api } from '../../../lib/api-client';

export const healthKeys = {
  all: ['health'] as const,
  current: () => [...healthKeys.all, 'current'] as const,
};

export const healthQueryOptions = () =>
  queryOptions({
    queryKey: healthKeys.current(),
    queryFn: ({ signal }) => api.get('/api/health/ready', healthSchema, undefined, signal),
    refetchInterval: 60_000,
    // A status card must report a failing server, not replace the page with an error.
    throwOnError: false,
  });

export const useHealth = () => useQuery(healthQueryOptions());
