import { mkdtempSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { readLazyRoutes } from '../../scripts/build/vite-route-preloads';
import { createTestContext, type TestContext } from '../helpers/test-app';

// docs/service-targets.md P8 (caseload LCP on the throttled phone): the page's HTML names a deep link's chunks and
// the session request, so a slow line fetches them beside the entry (DEVELOPERS.md "Web routing").
let ctx: TestContext;
let app: Express;
let webDist: string;

const SCRIPT = 'console.log("the first load");'.repeat(40);
const SHELL = `<!doctype html><html><head><title>Nestflow</title>
<script type="module" crossorigin src="/assets/index-1.js"></script>
</head><body><div id="root"></div></body></html>`;
// The shape the web build writes (scripts/build/vite-route-preloads.ts).
const PRELOADS = {
  always: ['/assets/zod-1.js'],
  routes: [
    { path: 'caseload', files: ['/assets/caseload.loader-1.js', '/assets/caseload.route-1.js', '/assets/table-1.js'] },
    { path: 'infants/:id', files: ['/assets/infant-record.route-1.js'] },
    { path: 'infants/:id/reading', files: ['/assets/reading.route-1.js'] },
  ],
};

const modulePreloads = (html: string) => [...html.matchAll(/<link rel="modulepreload" crossorigin href="([^"]+)">/g)].map((m) => m[1]);
const headOf = (html: string) => html.slice(0, html.indexOf('</head>'));

beforeAll(async () => {
  webDist = mkdtempSync(path.join(tmpdir(), 'nestflow-web-'));
  mkdirSync(path.join(webDist, 'assets'));
  writeFileSync(path.join(webDist, 'index.html'), SHELL);
  writeFileSync(path.join(webDist, 'route-preloads.json'), JSON.stringify(PRELOADS));
  writeFileSync(path.join(webDist, 'assets', 'index-1.js'), SCRIPT);
  // The build's precompressed copies (vite.config.ts); distinct bytes, so the test sees which file was sent.
  writeFileSync(path.join(webDist, 'assets', 'index-1.js.br'), brotliCompressSync(SCRIPT));
  writeFileSync(path.join(webDist, 'assets', 'index-1.js.gz'), gzipSync(SCRIPT, { level: 9 }));
  writeFileSync(path.join(webDist, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
  ctx = await createTestContext({ WEB_DIST: webDist });
  app = createApp(ctx.deps);
});

afterAll(async () => {
  await ctx.close();
  rmSync(webDist, { recursive: true, force: true });
});

describe('the app page for a deep link', () => {
  it('when the caseload is opened, then its head preloads the session schema and the caseload chunks, loader first', async () => {
    const res = await request(app).get('/caseload').expect(200).expect('content-type', /text\/html/);
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(modulePreloads(headOf(res.text))).toEqual([
      '/assets/zod-1.js',
      '/assets/caseload.loader-1.js',
      '/assets/caseload.route-1.js',
      '/assets/table-1.js',
    ]);
  });

  it('when any page is opened, then the session request is preloaded with the API client mode, before the entry script', async () => {
    for (const address of ['/caseload', '/', '/no-such-page']) {
      const head = headOf((await request(app).get(address).expect(200)).text);
      const preload = head.indexOf('<link rel="preload" href="/api/session" as="fetch" crossorigin>');
      expect(preload, address).toBeGreaterThan(-1);
      expect(preload, address).toBeLessThan(head.indexOf('<script type="module"'));
    }
  });

  it('when a path has parameters, then only the route with the same segments matches', async () => {
    expect(modulePreloads((await request(app).get('/infants/4f1c/').expect(200)).text)).toEqual([
      '/assets/zod-1.js',
      '/assets/infant-record.route-1.js',
    ]);
    expect(modulePreloads((await request(app).get('/infants/4f1c/reading').expect(200)).text)).toEqual([
      '/assets/zod-1.js',
      '/assets/reading.route-1.js',
    ]);
  });

  it('when the address is not a known page, then only what every page needs is preloaded', async () => {
    expect(modulePreloads((await request(app).get('/caseload/extra').expect(200)).text)).toEqual(['/assets/zod-1.js']);
    expect(modulePreloads((await request(app).get('/').expect(200)).text)).toEqual(['/assets/zod-1.js']);
  });
});

describe('the first data request of a deep link', () => {
  const fetchPreloads = (html: string) => [...headOf(html).matchAll(/<link rel="preload" href="([^"]+)" as="fetch" crossorigin>/g)].map((m) => m[1]!.replace(/&amp;/g, '&'));
  const withSession = (address: string) => request(app).get(address).set('cookie', 'nestflow.sid=s%3Aanything');

  it('when the caseload is opened with a session cookie, then its page request is preloaded right after the session, as the web client will ask for it', async () => {
    expect(fetchPreloads((await withSession('/caseload').expect(200)).text)).toEqual([
      '/api/session', '/api/infants?page=1&pageSize=25&sort=name&direction=next',
    ]);
    // Filters and sort from the address, a bad page size falling back to the default on its own (shared/http/list-view.ts).
    expect(fetchPreloads((await withSession('/caseload?status=on_oxygen&sort=-elevation&pageSize=oops&q=Ash').expect(200)).text)).toEqual([
      '/api/session', '/api/infants?page=1&pageSize=25&sort=-elevation&status=on_oxygen&q=Ash&direction=next',
    ]);
  });

  it('when the request would depend on who is signed in (a scope), there is no session cookie, or the page is another, then only the session is preloaded', async () => {
    expect(fetchPreloads((await withSession('/caseload?scope=mine').expect(200)).text)).toEqual(['/api/session']);
    expect(fetchPreloads((await request(app).get('/caseload').expect(200)).text)).toEqual(['/api/session']);
    expect(fetchPreloads((await withSession('/infants/4f1c').expect(200)).text)).toEqual(['/api/session']);
  });

  it('when the address carries markup, then the preload is escaped and the page stays well formed', async () => {
    const html = (await withSession('/caseload?q=%22%3E%3Cscript%3E').expect(200)).text;
    expect(html).not.toContain('"><script>');
    expect(fetchPreloads(html)[1]).toBe('/api/infants?page=1&pageSize=25&sort=name&q=%22%3E%3Cscript%3E&direction=next');
  });
});

describe('caching of the web build', () => {
  it('when a hashed bundle file is served, then browsers may keep it for a year without asking again', async () => {
    const res = await request(app).get('/assets/index-1.js').expect(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('when the browser takes brotli, then the build\'s brotli copy is sent as it is, with the same long cache', async () => {
    // Supertest undoes the brotli on the way in, so the body reads as the script.
    const res = await request(app).get('/assets/index-1.js').set('accept-encoding', 'gzip, deflate, br, zstd').expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers.vary).toMatch(/accept-encoding/i);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.text).toBe(SCRIPT);
  });

  it('when the browser takes gzip only, then the gzip copy is sent', async () => {
    const res = await request(app).get('/assets/index-1.js').set('accept-encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.text).toBe(SCRIPT);
  });

  it('when a file without a hash is served, then it is checked again within the hour', async () => {
    const res = await request(app).get('/favicon.svg').expect(200);
    expect(res.headers['cache-control']).toBe('public, max-age=3600');
  });

  it('when an old release asks for a bundle file this build lacks, then it is a 404 and not the app page', async () => {
    const res = await request(app).get('/assets/index-0.js').expect(404);
    expect(res.text).not.toContain('<!doctype html>');
  });
});

describe('the pages the web build lists', () => {
  it('when the router is read, then every lazy page is found with its loader asked for before its component', () => {
    const routes = readLazyRoutes(path.resolve('web/app/router.tsx'));
    const source = readFileSync('web/app/router.tsx', 'utf8');
    // Every `page(` call and every `lazy: () => import(` with a path of its own; the catch-all `*` is not a deep link.
    const expected = (source.match(/\bpage\('/g) ?? []).length + (source.match(/path: '[^'*]+', lazy: \(\) => import\(/g) ?? []).length;
    expect(routes).toHaveLength(expected);
    expect(routes.find((r) => r.path === 'caseload')?.modules.map((m) => path.relative('web/app', m))).toEqual([
      'routes/caseload.loader',
      'routes/caseload.route',
    ]);
    expect(routes.find((r) => r.path === 'sign-in')?.modules.map((m) => path.relative('web/app', m))).toEqual(['routes/sign-in.route']);
    expect(routes.map((r) => r.path)).toContain('infants/:id');
  });
});
