import { queryOptions } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const sessionKeys = {
  all: ['session'] as const,
  current: () => [...sessionKeys.all, 'current'] as const,
};

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.current(),
    // Asked before any page's code has loaded (web/main.tsx): the schema, and zod with it, loads beside the request.
    queryFn: ({ signal }) =>
      api.get('/api/session', import('@shared/schemas/session').then((m) => m.sessionResponseSchema), undefined, signal),
    staleTime: 5 * 60_000,
  });
