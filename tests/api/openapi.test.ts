import type { Request } from 'express';
import { validate as validateOpenApi, compileErrors } from '@readme/openapi-parser';
import type { OpenAPIV3_1 } from 'openapi-types';
import type { z } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { API_ROUTES } from '../../server/openapi/api-routes';
import { openApiPath } from '../../server/openapi/document';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent } from '../helpers/agents';
import { buildAndWalk, type MountedRoute } from '../helpers/route-walk';

// The API description (issue 15): generated from the zod contracts, checked against what Express really mounts.
let ctx: TestContext;
let routes: MountedRoute[];
let doc: OpenAPIV3_1.Document;

beforeAll(async () => {
  ctx = await createTestContext();
  const walked = buildAndWalk(() => createApp(ctx.deps));
  // Only the API: the web app's static files and page fallback are not part of it.
  routes = walked.routes.filter((r) => r.path.startsWith('/api/'));
  doc = (await (await anonymousAgent(walked.app)).get('/api/openapi.json').expect(200).expect('Content-Type', /application\/json/)).body;
});
afterAll(() => ctx.close());

const ERROR_REF = '#/components/schemas/Error';
const operation = (r: { method: string; path: string }) => doc.paths?.[openApiPath(r.path.replace(/^\/api/, ''))]?.[r.method as OpenAPIV3_1.HttpMethods];
const label = (r: { method: string; path: string }) => `${r.method.toUpperCase()} ${r.path}`;

type Contract = { params?: z.ZodType; query?: z.ZodType; body?: z.ZodType };
/** The contracts a mounted route validates with, read from its `validate(...)` handlers (per-country ones for GB). */
function contractsOf(r: MountedRoute): Contract {
  const out: Contract = {};
  const fakeReq = { user: { programmeCountry: 'GB' } } as unknown as Request;
  for (const h of r.handlers) {
    const c = (h as { contract?: Contract | ((req: Request) => Contract) }).contract;
    if (c) Object.assign(out, typeof c === 'function' ? c(fakeReq) : c);
  }
  return out;
}

describe('OpenAPI description: served and valid', () => {
  it('when anyone asks for /api/openapi.json, then it is an OpenAPI 3.1 document that a validator accepts', async () => {
    expect(doc.openapi).toBe('3.1.0');
    // @readme/openapi-parser checks the document against the OpenAPI 3.1 schema and the specification's own rules.
    const result = await validateOpenApi(structuredClone(doc) as never);
    expect(result.valid, result.valid ? '' : compileErrors(result)).toBe(true);
  });

  it('when the document is counted, then it has exactly the routes Express mounts under /api', () => {
    const documented = Object.entries(doc.paths ?? {}).flatMap(([p, item]) => Object.keys(item ?? {}).filter((k) => ['get', 'post', 'put', 'patch', 'delete'].includes(k)).map((m) => `${m.toUpperCase()} ${p}`));
    const mounted = routes.map((r) => `${r.method.toUpperCase()} ${openApiPath(r.path.replace(/^\/api/, ''))}`);
    expect(new Set(mounted).size).toBe(mounted.length);
    expect(documented.sort()).toEqual([...mounted].sort());
    console.info(`OpenAPI description: ${documented.length} routes`);
    // The CSV exports are among them.
    expect(documented).toEqual(expect.arrayContaining(['GET /infants.csv', 'GET /infants/{id}/readings.csv', 'GET /messages.csv', 'GET /openapi.json']));
  });
});

describe('OpenAPI description: every mounted route, with its contracts and errors', () => {
  it('when each mounted route is looked up, then it has a success answer with its schema and the shared error body', () => {
    const problems: string[] = [];
    for (const r of routes) {
      const op = operation(r);
      if (!op) {
        problems.push(`${label(r)}: missing`);
        continue;
      }
      const answers = Object.entries(op.responses ?? {});
      const ok = answers.filter(([s]) => /^2\d\d$/.test(s));
      if (!ok.length) problems.push(`${label(r)}: no success response`);
      for (const [status, res] of ok) {
        const content = (res as OpenAPIV3_1.ResponseObject).content;
        const schemas = Object.values(content ?? {}).map((c) => c.schema);
        if (status !== '204' && (!schemas.length || schemas.some((s) => !s || Object.keys(s).length === 0))) problems.push(`${label(r)}: ${status} has no response schema`);
      }
      const errors = answers.filter(([s]) => /^4\d\d$/.test(s));
      // A public route without inputs (GET /session, /health) has no client error to describe; every other route has.
      const declared = API_ROUTES.find((d) => d.method === r.method && `/api${d.path}` === r.path);
      const canRefuse = (declared?.auth ?? 'session') !== 'public' || r.method !== 'get' || declared?.params || declared?.query;
      if (canRefuse && !errors.length) problems.push(`${label(r)}: no error response`);
      for (const [status, res] of [...errors, ['default', op.responses?.default] as const]) {
        const ref = ((res as OpenAPIV3_1.ResponseObject | undefined)?.content?.['application/json']?.schema as OpenAPIV3_1.ReferenceObject | undefined)?.$ref;
        if (ref !== ERROR_REF) problems.push(`${label(r)}: ${status} is not the shared error body`);
      }
      for (const name of r.path.match(/:([A-Za-z_]+)/g) ?? []) {
        const declared = (op.parameters ?? []).some((p) => (p as OpenAPIV3_1.ParameterObject).in === 'path' && (p as OpenAPIV3_1.ParameterObject).name === name.slice(1));
        if (!declared) problems.push(`${label(r)}: path parameter ${name} not described`);
      }
    }
    expect(problems).toEqual([]);
  });

  it('when a route validates its params, query or body, then the description declares the very same zod contracts', () => {
    // The SMS webhook checks its provider's signature before reading the form, so it parses inboundSmsSchema itself
    // (no validate middleware); its description names that schema.
    const parsesItself = new Set(['POST /api/webhooks/sms']);
    const problems: string[] = [];
    for (const r of routes) {
      const declared = API_ROUTES.find((d) => d.method === r.method && `/api${d.path}` === r.path);
      if (!declared) {
        problems.push(`${label(r)}: not declared in a module's *.api.ts`);
        continue;
      }
      if (parsesItself.has(label(r))) continue;
      const used = contractsOf(r);
      for (const part of ['params', 'query', 'body'] as const) {
        if (used[part] !== declared[part]) problems.push(`${label(r)}: ${part} differs from the contract the router validates with`);
      }
    }
    expect(problems).toEqual([]);
  });

  it('when a route has a request contract, then its parameters or body appear in the document', () => {
    const problems: string[] = [];
    for (const d of API_ROUTES) {
      const op = operation({ method: d.method, path: `/api${d.path}` });
      if (d.query && !(op?.parameters ?? []).some((p) => (p as OpenAPIV3_1.ParameterObject).in === 'query')) problems.push(`${d.method} ${d.path}: query not described`);
      if (d.body && !op?.requestBody) problems.push(`${d.method} ${d.path}: body not described`);
    }
    expect(problems).toEqual([]);
  });

  it('when the error statuses are read, then 400, 401, 403, 404, 409 and 422 appear where the routes can answer them', () => {
    const statuses = (method: string, path: string) => Object.keys(operation({ method, path })?.responses ?? {});
    expect(statuses('patch', '/api/infants/:id')).toEqual(expect.arrayContaining(['200', '400', '401', '403', '404', '409', '422']));
    expect(statuses('get', '/api/infants.csv')).toEqual(expect.arrayContaining(['200', '400', '401', '403']));
    expect(statuses('get', '/api/infants/:id/readings.csv')).toContain('404');
    expect(statuses('get', '/api/session')).not.toContain('401');
    const csv = operation({ method: 'get', path: '/api/messages.csv' })?.responses?.['200'] as OpenAPIV3_1.ResponseObject;
    expect(Object.keys(csv.content ?? {})).toEqual(['text/csv']);
  });

  it('when the exports, the discharge step and equipment orders are read, then their media types and the errors their services raise appear', () => {
    const op = (method: string, path: string) => operation({ method, path });
    const statuses = (method: string, path: string) => Object.keys(op(method, path)?.responses ?? {});
    const media = (method: string, path: string) => Object.keys((op(method, path)?.responses?.['200'] as OpenAPIV3_1.ResponseObject | undefined)?.content ?? {});
    expect(media('get', '/api/infants/:id/fhir')).toEqual(['application/fhir+json']);
    for (const pdf of ['/api/infants/:id/discharge-letter.pdf', '/api/infants/:id/care-plan.pdf']) {
      expect(media('get', pdf)).toEqual(['application/pdf']);
      expect((op('get', pdf)?.responses?.['200'] as OpenAPIV3_1.ResponseObject).content?.['application/pdf'].schema).toMatchObject({ type: 'string', format: 'binary' });
    }
    // DischargeNotReadyError (422 discharge_not_ready) and the consultant-only override (403).
    expect(statuses('post', '/api/infants/:id/discharge')).toEqual(expect.arrayContaining(['200', '400', '403', '404', '422']));
    // No approved setting yet (409); the mail server refusing the letter (503).
    expect(statuses('post', '/api/infants/:id/discharge-letter/email')).toEqual(expect.arrayContaining(['409', '503']));
    expect(statuses('get', '/api/infants/:id/discharge-letter.pdf')).toContain('409');
    for (const action of ['send', 'cancel']) expect(statuses('post', `/api/equipment-orders/:id/${action}`)).toEqual(expect.arrayContaining(['200', '404', '409']));
    expect(statuses('post', '/api/infants/:id/equipment-orders')).toContain('201');
    // The chain's routes take no input: nothing to refuse with 400, and no record in the path to miss.
    expect(statuses('post', '/api/audit/chain/verify')).toEqual(['200', '401', '403', 'default']);
  });
});
