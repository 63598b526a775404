import type { ReactNode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { Toaster } from '../components/ui/toaster';
import { showToast } from '../components/ui/toast-store';
import { endLocalSession } from '../features/session/api/end-local-session';
import { sessionQueryOptions } from '../features/session/api/session-keys';
import { configureApiClient } from '../lib/api-client';
import { createQueryClient } from '../lib/query-client';

/** One query client per page load, and the API client wired to it for CSRF tokens and expired sessions. */
export function createAppQueryClient(options: { retry?: boolean } = {}): QueryClient {
  const queryClient = createQueryClient(showToast, options);
  configureApiClient({
    getCsrfToken: async () => (await queryClient.ensureQueryData(sessionQueryOptions())).csrfToken,
    refreshCsrfToken: async () => (await queryClient.fetchQuery({ ...sessionQueryOptions(), staleTime: 0 })).csrfToken,
    onUnauthenticated: () => endLocalSession(queryClient),
  });
  return queryClient;
}

export function AppProviders({ queryClient, children }: { queryClient: QueryClient; children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      {children}
      <Toaster />
    </QueryClientProvider>
  );
}
