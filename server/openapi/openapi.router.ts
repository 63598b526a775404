import { Router } from 'express';
import { z } from 'zod';
import { json, route, type ApiRoute } from './api-route';
import { buildOpenApiDocument } from './document';

export const openapiApi = [
  route('get', '/openapi.json', { summary: 'This description (OpenAPI 3.1)', who: 'anyone: it holds no patient data', auth: 'public', responses: { 200: json('The OpenAPI document', z.record(z.string(), z.unknown())) } }),
];

/**
 * GET /api/openapi.json, public: it describes the routes and contracts, which the web bundle already shows anyone,
 * and no record. Built once, on the first request.
 */
export function openapiRouter(routes: () => readonly ApiRoute[], version: string): Router {
  const r = Router();
  let doc: unknown;
  r.get('/', (_req, res) => {
    doc ??= buildOpenApiDocument(routes(), version);
    res.set('Cache-Control', 'no-cache');
    res.json(doc);
  });
  return r;
}
