import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { errorMessage, isApiError, isServerError } from './api-error';

export interface NestflowMutationMeta extends Record<string, unknown> {
  /** Error codes the form shows beside its fields, so no toast repeats them. */
  inlineErrors?: readonly string[];
  successToast?: (data: unknown) => string;
}

declare module '@tanstack/react-query' {
  interface Register {
    mutationMeta: NestflowMutationMeta;
  }
}

type Notify = (tone: 'ok' | 'danger', message: string) => void;

const MAX_RETRIES = 2;

/** 4xx answers will not change on retry; network blips and 5xx may. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < MAX_RETRIES;
}

const isSignedOut = (error: unknown) => isApiError(error) && error.status === 401;

export function createQueryClient(notify: Notify, options: { retry?: boolean } = {}): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({
      // A first load that fails is shown by the page itself; only a failed refresh of data on screen needs a toast.
      onError: (error, query) => {
        if (query.state.data !== undefined && !isSignedOut(error)) notify('danger', errorMessage(error));
      },
    }),
    mutationCache: new MutationCache({
      onSuccess: (data, _variables, _context, mutation) => {
        const toast = mutation.meta?.successToast;
        if (toast) notify('ok', toast(data));
      },
      onError: (error, _variables, _context, mutation) => {
        if (isSignedOut(error)) return;
        if (isApiError(error) && mutation.meta?.inlineErrors?.includes(error.code)) return;
        notify('danger', errorMessage(error));
      },
    }),
    defaultOptions: {
      queries: {
        retry: options.retry === false ? false : shouldRetry,
        staleTime: 30_000,
        // 5xx on a first load goes to the route's error boundary; with data already on screen a toast is enough.
        throwOnError: (error, query) => query.state.data === undefined && isServerError(error),
      },
      mutations: { retry: false },
    },
  });
}
