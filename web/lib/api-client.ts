import type { z } from 'zod';
import { apiPath } from '@shared/http/list-view';
import { ApiError } from './api-error';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export type QueryParams = Record<string, string | number | undefined | null>;

/**
 * A response schema, or the promise of one: the session check runs before any page's code has loaded, and passing
 * it `import(...)` keeps zod out of the first download (the schema arrives while the request is on its way).
 */
export type ResponseSchema<T> = z.ZodType<T> | Promise<z.ZodType<T>>;

export interface RequestOptions<T> {
  method?: Method;
  query?: QueryParams;
  body?: unknown;
  schema?: ResponseSchema<T>;
  signal?: AbortSignal;
  /** Sign-in answers 401 for a wrong password; that must not bounce the user back to sign-in. */
  redirectOn401?: boolean;
}

interface ClientHooks {
  getCsrfToken: () => Promise<string | undefined>;
  refreshCsrfToken: () => Promise<string | undefined>;
  onUnauthenticated: () => void;
}

// Wired once by the app providers; the client itself must not know about the query cache or the router.
let hooks: ClientHooks = {
  getCsrfToken: async () => undefined,
  refreshCsrfToken: async () => undefined,
  onUnauthenticated: () => {},
};

export function configureApiClient(next: Partial<ClientHooks>): void {
  hooks = { ...hooks, ...next };
}


async function send<T>(path: string, options: RequestOptions<T>, csrfToken?: string): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (csrfToken) headers['X-CSRF-Token'] = csrfToken;
  try {
    return await fetch(apiPath(path, options.query), {
      method: options.method ?? 'GET',
      credentials: 'same-origin',
      headers,
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({ status: 0, code: 'network', message: 'Nestflow could not be reached. Check the connection and try again.' });
  }
}

async function toApiError(response: Response): Promise<ApiError> {
  const body: unknown = await response.json().catch(() => undefined);
  // Loaded only when an answer is an error, so the first page load carries no zod.
  const common = await import('@shared/schemas/common').catch(() => undefined);
  const parsed = common?.errorBodySchema.safeParse(body);
  if (parsed?.success) return new ApiError({ status: response.status, ...parsed.data.error });
  // A proxy or a crashed process can answer without our error shape.
  const message =
    response.status >= 500
      ? 'The server could not complete this request. Try again in a moment.'
      : `The request failed (${response.status}).`;
  return new ApiError({ status: response.status, code: `http_${response.status}`, message });
}

export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  // A schema still loading must not fail unobserved when the request itself fails first.
  if (options.schema instanceof Promise) options.schema.catch(() => undefined);
  const method = options.method ?? 'GET';
  const unsafe = method !== 'GET';
  let response = await send(path, options, unsafe ? await hooks.getCsrfToken() : undefined);
  let error = response.ok ? undefined : await toApiError(response);

  if (unsafe && error?.code === 'csrf_invalid') {
    // The session was renewed (e.g. sign-in in another tab). The server refused before acting, so one retry is safe.
    response = await send(path, options, await hooks.refreshCsrfToken());
    error = response.ok ? undefined : await toApiError(response);
  }
  if (error) {
    if (error.status === 401 && options.redirectOn401 !== false) hooks.onUnauthenticated();
    throw error;
  }
  if (response.status === 204 || !options.schema) return undefined as T;

  const body: unknown = await response.json().catch(() => undefined);
  const parsed = (await options.schema).safeParse(body);
  if (!parsed.success) {
    throw new ApiError({ status: response.status, code: 'unexpected_response', message: 'The server sent an answer this page cannot read.' });
  }
  return parsed.data;
}

export const api = {
  get: <T>(path: string, schema: ResponseSchema<T>, query?: QueryParams, signal?: AbortSignal) =>
    apiRequest<T>(path, { schema, query, signal }),
  post: <T = void>(path: string, body?: unknown, schema?: z.ZodType<T>, extra?: Pick<RequestOptions<T>, 'redirectOn401'>) =>
    apiRequest<T>(path, { method: 'POST', body, schema, ...extra }),
  delete: (path: string) => apiRequest<void>(path, { method: 'DELETE' }),
};
