import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { errorBodySchema } from '@shared/schemas/common';
import { errorStatuses, type ApiRoute } from './api-route';

// The one error body every route answers with, named once in components (zod's own `meta({ id })`, which the
// generator reads as a reference name).
const errorBody = errorBodySchema.meta({ id: 'Error', description: 'The error body: a stable code, a readable message, per-field details where there are some, and the request id of the access-log line' });

const ERROR_WORDS: Record<number, string> = {
  400: 'The request is malformed or fails its contract (validation_failed lists each field in details)',
  401: 'Not signed in',
  403: 'Not allowed, or the CSRF token is missing or out of date',
  404: 'No such record in the caller’s reach (another programme’s record is a 404 too)',
  409: 'Changed meanwhile or in a state that does not allow this',
  413: 'Too large',
  415: 'Not a media type or encoding the route accepts',
  422: 'Needs confirmation, or the programme’s rules are not met (details say which)',
  429: 'Too many attempts; Retry-After says when to try again',
  503: 'Not available now',
};

/** Express's ':id' becomes OpenAPI's '{id}'. */
export const openApiPath = (expressPath: string) => expressPath.replace(/:([A-Za-z_]+)/g, '{$1}');

function requestBody(r: ApiRoute) {
  if (!r.body) return undefined;
  const type = r.bodyType ?? 'application/json';
  const schema = r.files?.length ? z.intersection(z.object(Object.fromEntries(r.files.map((f) => [f, z.string().meta({ format: 'binary', description: 'The file' })]))), r.body) : r.body;
  return { body: { required: true, content: { [type]: { schema } } } };
}

/** The OpenAPI 3.1 description of the routes, generated from the zod contracts they validate and answer with. */
export function buildOpenApiDocument(routes: readonly ApiRoute[], version: string) {
  const registry = new OpenAPIRegistry();
  const error = errorBody;
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'nestflow.sid', description: 'The session cookie set by POST /session' });
  for (const r of routes) {
    const responses: Record<string, { description: string; content?: Record<string, { schema: z.ZodType }> }> = {};
    for (const [status, res] of Object.entries(r.responses)) {
      responses[status] = res.schema ? { description: res.description, content: { [res.type ?? 'application/json']: { schema: res.schema } } } : { description: res.description };
    }
    for (const status of errorStatuses(r)) responses[String(status)] ??= { description: ERROR_WORDS[status] ?? 'Error', content: { 'application/json': { schema: error } } };
    responses.default = { description: 'Unexpected failure (500) or a dependency briefly unavailable (503)', content: { 'application/json': { schema: error } } };
    registry.registerPath({
      method: r.method,
      path: openApiPath(r.path),
      summary: r.summary,
      description: `Who: ${r.who}.${(r.auth ?? 'session') === 'session' && r.method !== 'get' ? ' Send the CSRF token from GET /session as X-CSRF-Token.' : ''}`,
      security: (r.auth ?? 'session') === 'session' ? [{ session: [] }] : [],
      request: {
        ...(r.params ? { params: r.params as z.ZodObject } : {}),
        ...(r.query ? { query: r.query as z.ZodObject } : {}),
        ...requestBody(r),
      },
      responses,
    });
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Nestflow API', version, description: 'Home oxygen programme planner. Errors share one body: { error: { code, message, details?, requestId } }.' },
    servers: [{ url: '/api' }],
  });
}
