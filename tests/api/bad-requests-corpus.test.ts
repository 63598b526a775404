import { mkdtempSync, mkdirSync, writeFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent, type Agent } from '../helpers/agents';
import { makeProgrammeWithStaff } from '../helpers/factories';
import { buildAndWalk, type MountedRoute } from '../helpers/route-walk';

// R10 (docs/service-targets.md): a corpus of bad requests over every mounted route; none may answer 500.
let ctx: TestContext;
let app: Express;
let routes: MountedRoute[];
let webDist: string;
let agents: Record<'anonymous' | 'admin' | 'coordinator' | 'nurse' | 'family', Agent>;

beforeAll(async () => {
  webDist = mkdtempSync(path.join(tmpdir(), 'nestflow-web-'));
  mkdirSync(path.join(webDist, 'assets'));
  writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><title>Nestflow</title>');
  writeFileSync(path.join(webDist, 'assets', 'app-1.js'), 'console.log(1)');
  ctx = await createTestContext({ WEB_DIST: webDist, INBOUND_WEBHOOK_URL: 'http://nestflow.test/api/webhooks/sms' });
  ({ app, routes } = buildAndWalk(() => createApp(ctx.deps)));
  const a = await makeProgrammeWithStaff(ctx.deps);
  agents = {
    anonymous: await anonymousAgent(app),
    admin: await signedInAgent(app, a.people.admin.email),
    coordinator: await signedInAgent(app, a.people.coordinator.email),
    nurse: await signedInAgent(app, a.people.nurse.email),
    family: await signedInAgent(app, a.people.family.email),
  };
});
afterAll(async () => {
  await ctx.close();
  rmSync(webDist, { recursive: true, force: true });
});

const SOME_ID = '5b1c0a55-0000-4000-8000-00000000c0de';
const withParams = (p: string, value: string) => p.replace(/:[A-Za-z]+/g, value).replace('/{*splat}', '/x');

type Bad = { name: string; path: (route: MountedRoute) => string; send: (t: request.Test) => request.Test };
const json = (body: string) => (t: request.Test) => t.set('Content-Type', 'application/json').send(body);

/** Each bad input, applied to a route's method and path. */
const CORPUS: Bad[] = [
  { name: 'NUL in every text value', path: (r) => withParams(r.path, SOME_ID), send: json('{"name":"a\\u0000b","q":"\\u0000","notes":"x\\u0000","reason":"\\u0000\\u0000","email":"a\\u0000@b.example"}') },
  { name: 'control characters in search parameters', path: (r) => `${withParams(r.path, SOME_ID)}?q=%00%1B%7F&page=%00&sort=%00`, send: (t) => t },
  { name: 'NUL in a path parameter', path: (r) => withParams(r.path, '%00'), send: (t) => t },
  { name: 'malformed percent-encoding in a path parameter', path: (r) => withParams(r.path, '%E0%A4%A'), send: (t) => t },
  { name: 'JSON with a bogus charset', path: (r) => withParams(r.path, SOME_ID), send: (t) => t.set('Content-Type', 'application/json; charset=bogus').send('{"a":"b"}') },
  { name: 'an unsupported Content-Encoding', path: (r) => withParams(r.path, SOME_ID), send: (t) => t.set('Content-Type', 'application/json').set('Content-Encoding', 'x-bogus').send('{"a":"b"}') },
  { name: 'a gzip header on a body that is not gzip', path: (r) => withParams(r.path, SOME_ID), send: (t) => t.set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('{"a":"b"}') },
  { name: 'JSON that is not JSON', path: (r) => withParams(r.path, SOME_ID), send: json('{"a":') },
  { name: 'a lone UTF-16 surrogate', path: (r) => withParams(r.path, SOME_ID), send: json('{"name":"\\ud800","notes":"\\udfff"}') },
];

function call(agent: Agent, route: MountedRoute, bad: Bad) {
  const t = (agent as unknown as Record<string, (p: string) => request.Test>)[route.method](bad.path(route)).set('X-CSRF-Token', agent.csrf);
  return bad.send(t);
}

describe('the corpus of bad requests over every mounted route', () => {
  it('when the routes are walked, then the API routes of every feature are found', () => {
    const paths = new Set(routes.map((r) => `${r.method.toUpperCase()} ${r.path}`));
    for (const known of ['POST /api/session', 'GET /api/users', 'POST /api/infants', 'PATCH /api/readings/:id', 'POST /api/webhooks/sms', 'PUT /api/me/password', 'POST /api/account/set-password']) {
      expect(paths).toContain(known);
    }
    expect(routes.length).toBeGreaterThan(50);
  });

  it('when every bad input is sent to every route as every kind of caller, then nothing answers 500', async () => {
    const failures: string[] = [];
    // Signing out (DELETE /api/session) goes last, so every other route is tried with the callers still signed in.
    const ordered = [...routes].sort((a, b) => Number(a.method === 'delete' && a.path === '/api/session') - Number(b.method === 'delete' && b.path === '/api/session'));
    for (const route of ordered) {
      for (const bad of CORPUS) {
        for (const [who, agent] of Object.entries(agents)) {
          const res = await call(agent, route, bad);
          if (res.status >= 500 && res.status !== 503) failures.push(`${who} ${route.method.toUpperCase()} ${route.path} — ${bad.name}: ${res.status} ${JSON.stringify(res.body)}`);
          else if (res.status === 503 && !res.body?.error?.code) failures.push(`${who} ${route.path} ${bad.name}: 503 without an error body`);
        }
      }
    }
    expect(failures).toEqual([]);
  }, 240_000);
});

describe('each kind of bad input gets its own clear answer', () => {
  beforeAll(async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    agents.admin = await signedInAgent(app, a.people.admin.email);
  });
  const post = (a: Agent, p: string) => a.post(p).set('X-CSRF-Token', a.csrf);

  it('when JSON comes in an unsupported charset, then 415 unsupported_charset', async () => {
    const res = await post(agents.admin, '/api/users').set('Content-Type', 'application/json; charset=bogus').send('{"a":"b"}');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_charset');
  });

  it('when the body has an unknown Content-Encoding, then 415; when it claims gzip but is not, then 400 — and a real gzip body works', async () => {
    const unknown = await post(agents.admin, '/api/users').set('Content-Type', 'application/json').set('Content-Encoding', 'x-bogus').send('{}');
    expect(unknown.status).toBe(415);
    expect(unknown.body.error.code).toBe('unsupported_encoding');
    const fake = await post(agents.admin, '/api/users').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('{"a":"b"}');
    expect(fake.status).toBe(400);
    expect(fake.body.error.code).toBe('bad_encoding');
    const real = await post(agents.admin, '/api/users').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').serialize((b: Buffer) => b as unknown as string).send(gzipSync('{"email":"x"}'));
    expect(real.status).toBe(400);
    expect(real.body.error.code).toBe('validation_failed');
  });

  it('when the SMS webhook gets a form in an unsupported charset, then 415', async () => {
    const res = await request(app).post('/api/webhooks/sms').set('Content-Type', 'application/x-www-form-urlencoded; charset=bogus').send('From=%2B447700900121&Body=STOP');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_charset');
  });

  it('when a path holds malformed percent-encoding, then 400 (API and pages alike)', async () => {
    const api = await agents.admin.get('/api/infants/%E0%A4%A');
    expect(api.status).toBe(400);
    expect(api.body.error.code).toBe('bad_request');
    expect((await request(app).get('/caseload/%E0%A4%A')).status).toBe(400);
  });

  it('when a file under /assets/ does not exist, then 404 rather than the app page; a real one and app pages still load', async () => {
    const missing = await request(app).get('/assets/app-0ld.js');
    expect(missing.status).toBe(404);
    expect(missing.text).not.toContain('<title>Nestflow</title>');
    expect((await request(app).get('/assets/app-1.js')).status).toBe(200);
    const page = await request(app).get('/caseload');
    expect(page.status).toBe(200);
    expect(page.text).toContain('<title>Nestflow</title>');
  });
});
