import { queryOptions } from '@tanstack/react-query';
import { sessionResponseSchema } from '@shared/schemas/session';
import { api } from '../../../lib/api-client';

export const sessionKeys = {
  all: ['session'] as const,
  current: () => [...sessionKeys.all, 'current'] as const,
};

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.current(),
    queryFn: ({ signal }) => api.get('/api/session', sessionResponseSchema, undefined, signal),
    staleTime: 5 * 60_000,
  });
