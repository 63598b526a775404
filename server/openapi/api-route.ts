import { z } from 'zod';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** One answer of a route: its status, the zod contract of its body (none for 204) and the media type if not JSON. */
export interface ApiResponse {
  description: string;
  schema?: z.ZodType;
  type?: string;
}

/**
 * What the API description says about one mounted route. `params`, `query` and `body` must be the very contracts the
 * route's `validate(...)` uses (tests/api/openapi.test.ts checks them against the mounted app); per-country contracts
 * are given for the default country.
 */
export interface ApiRoute {
  method: Method;
  /** Express form under /api, e.g. '/infants/:id/readings'. */
  path: string;
  summary: string;
  /** Who may call it, in words. */
  who: string;
  /** 'session' (the default): signed in, CSRF token on writes; 'public': no session needed; 'signature': the SMS provider's signed webhook. */
  auth?: 'session' | 'public' | 'signature';
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
  /** The request body's media type when not JSON. */
  bodyType?: string;
  /** File fields of a multipart body, beside the form fields `body` describes. */
  files?: string[];
  responses: Record<number, ApiResponse>;
  /** Error statuses beyond those every route of its kind has (400 for bad input, 401, 403, 404 for an id in the path). */
  errors?: number[];
}

/** Declares a route for the API description: `route('get', '/infants/:id/fhir', { ... })`. */
export const route = (method: Method, path: string, spec: Omit<ApiRoute, 'method' | 'path'>): ApiRoute => ({ method, path, ...spec });

/** The error statuses a route can answer with the shared error body. */
export function errorStatuses(r: ApiRoute): number[] {
  const out = new Set<number>(r.errors ?? []);
  if (r.params || r.query || r.body) out.add(400);
  if ((r.auth ?? 'session') === 'session') {
    out.add(401);
    out.add(403);
  }
  // Writes need the CSRF token (403 without it); the webhook answers 403 to a bad signature instead.
  if (r.method !== 'get') out.add(403);
  if (r.path.includes('/:')) out.add(404);
  return [...out].sort((a, b) => a - b);
}

export const json = (description: string, schema: z.ZodType): ApiResponse => ({ description, schema });

/** A PDF download: binary, `application/pdf`. */
export const pdfFile = (description: string): ApiResponse => ({ description, type: 'application/pdf', schema: z.string().meta({ format: 'binary' }) });
