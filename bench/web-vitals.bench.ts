// docs/service-targets.md P8: lab LCP and CLS of the caseload page in headless Chromium (LCP ≤ 2.5 s, Core Web Vitals'
// "good", on the desktop and ≤ 2.0 s on the throttled phone; CLS ≤ 0.05), and no third-party origin at load. The real
// API (server/main.ts, serving the web build) runs against the caseload benchmark's 20,000 babies; each load uses a
// fresh profile (cold cache) holding the coordinator's session. Two profiles, alternated: desktop on loopback, and a
// phone-sized window with DevTools-style throttling (150 ms RTT, 1.6 Mbit/s down, CPU 4× slower). Prints figures only.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import { openBrowser } from '../tests/helpers/browser';

const ADMIN_URL = process.env.BENCH_ADMIN_URL ?? 'postgres://postgres@127.0.0.1:54329/postgres';
const BENCH_URL = process.env.BENCH_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/nestflow_bench';
const DIST = path.resolve(process.env.BENCH_WEB_DIST ?? 'dist/web');
const PORT = Number(process.env.BENCH_WEB_PORT ?? 3390);
const BASE = `http://127.0.0.1:${PORT}`;
// The coordinator and password bench/caseload.bench.ts seeds into nestflow_bench.
const EMAIL = 'coordinator@bench.example';
const PASSWORD = 'bench-only-password';
const RUNS = 5;

interface Profile {
  name: string;
  viewport: { width: number; height: number };
  throttle: boolean;
  /** LCP target in seconds: Core Web Vitals' "good" on the desktop, P8's tighter figure on the slow phone. */
  lcpTarget: number;
}
const PROFILES: Profile[] = [
  { name: 'desktop 1280×860, loopback', viewport: { width: 1280, height: 860 }, throttle: false, lcpTarget: 2.5 },
  { name: 'phone 412×823, throttled', viewport: { width: 412, height: 823 }, throttle: true, lcpTarget: 2.0 },
];

interface Load {
  lcpMs: number;
  lcpElement: string;
  fcpMs: number;
  rowsMs: number;
  cls: number;
  shiftSum: number;
  requests: number;
  origins: string[];
}

const node = (args: string[], env: NodeJS.ProcessEnv) => spawnSync(process.execPath, ['--import', 'tsx', ...args], { env, stdio: 'inherit' });

/** The caseload benchmark owns the bench database; run it first when the babies or its coordinator are missing. */
async function prepareDatabase(env: NodeJS.ProcessEnv) {
  const admin = new pg.Client({ connectionString: ADMIN_URL });
  await admin.connect();
  const exists = (await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'nestflow_bench'`)).rowCount;
  await admin.end();
  let seeded = false;
  if (exists) {
    const db = new pg.Client({ connectionString: BENCH_URL });
    await db.connect();
    seeded = Boolean((await db.query(`SELECT 1 FROM users WHERE email = $1`, [EMAIL]).catch(() => ({ rowCount: 0 }))).rowCount);
    await db.end();
  }
  const step = seeded ? node(['server/db/migrate.ts'], env) : node(['bench/caseload.bench.ts'], process.env);
  if (step.status !== 0) throw new Error(`preparing nestflow_bench failed (exit ${step.status})`);
}

async function waitForHealth(child: ChildProcess) {
  const until = Date.now() + 30_000;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`the API exited ${child.exitCode} (is port ${PORT} free?)`);
    const ok = await fetch(`${BASE}/api/health`).then((r) => r.ok, () => false);
    if (ok) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the API did not become healthy at ${BASE}`);
}

async function signIn(): Promise<{ name: string; value: string }> {
  const first = await fetch(`${BASE}/api/session`);
  const cookie = first.headers.get('set-cookie')!.split(';')[0];
  const { csrfToken } = await first.json();
  const res = await fetch(`${BASE}/api/session`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email: EMAIL, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in answered ${res.status}`);
  // The answer also clears the signed-out visitor's CSRF cookie; the session cookie is the one to keep.
  const sid = res.headers.getSetCookie().map((c) => c.split(';')[0]).find((c) => c.startsWith('nestflow.sid='));
  if (!sid) throw new Error('sign-in set no session cookie');
  const at = sid.indexOf('=');
  return { name: sid.slice(0, at), value: sid.slice(at + 1) };
}

async function measure(profile: Profile, session: { name: string; value: string }): Promise<Load> {
  const browser = await openBrowser(profile.viewport);
  try {
    const { context, page } = browser;
    await context.addCookies([{ ...session, url: BASE, httpOnly: true, sameSite: 'Lax' }]);
    const origins = new Set<string>();
    let requests = 0;
    context.on('request', (req) => {
      requests++;
      origins.add(new URL(req.url()).origin);
    });
    // The LCP element need not be the list, so also note when the first baby of the caseload enters the page.
    await context.addInitScript(ROWS_WATCH);
    if (profile.throttle) {
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      await cdp.send('Network.emulateNetworkConditions', {
        offline: false, latency: 150, downloadThroughput: (1.6 * 1024 * 1024) / 8, uploadThroughput: (750 * 1024) / 8,
      });
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    }
    await page.goto(`${BASE}/caseload`);
    await page.locator(FIRST_BABY).first().waitFor({ timeout: 60_000 });
    if (!page.url().endsWith('/caseload')) throw new Error(`landed on ${page.url()}, not the caseload`);
    await page.waitForLoadState('networkidle');
    await page.waitForTimeout(500); // a last paint after the rows
    return {
      ...((await page.evaluate(READ_VITALS)) as Omit<Load, 'requests' | 'origins'>),
      requests,
      origins: [...origins],
    };
  } finally {
    await browser.close();
  }
}

// A wide window shows the caseload as a table, a phone as one card per baby: either way each baby links to its record.
const FIRST_BABY = 'main a[href^="/infants/"]';
const ROWS_WATCH = `new MutationObserver((_, o) => {
  if (document.querySelector('${FIRST_BABY}')) { window.__rowsAt = performance.now(); o.disconnect(); }
}).observe(document, { childList: true, subtree: true });`;

/**
 * Runs in the page: buffered entries; CLS as the largest session window (gaps < 1 s, at most 5 s) of shifts without
 * recent input. Plain JavaScript in a string, because tsx wraps named functions in a helper the page does not have.
 */
const READ_VITALS = `(async () => {
  const buffered = (type) => new Promise((resolve) => {
    const seen = [];
    new PerformanceObserver((list) => seen.push(...list.getEntries())).observe({ type, buffered: true });
    setTimeout(() => resolve(seen), 100);
  });
  const [lcps, shifts, paints] = await Promise.all([buffered('largest-contentful-paint'), buffered('layout-shift'), buffered('paint')]);
  let cls = 0, shiftSum = 0, win = 0, first = 0, last = 0;
  for (const s of shifts.filter((e) => !e.hadRecentInput)) {
    shiftSum += s.value;
    if (win && s.startTime - last < 1000 && s.startTime - first < 5000) win += s.value;
    else { win = s.value; first = s.startTime; }
    last = s.startTime;
    cls = Math.max(cls, win);
  }
  const lcp = lcps.at(-1);
  const el = lcp && lcp.element;
  return {
    lcpMs: lcp ? lcp.startTime : NaN,
    lcpElement: el ? el.tagName.toLowerCase() + ' "' + (el.textContent || '').trim().slice(0, 40) + '"' : 'unknown',
    fcpMs: (paints.find((p) => p.name === 'first-contentful-paint') || { startTime: NaN }).startTime,
    rowsMs: window.__rowsAt ?? NaN,
    cls,
    shiftSum,
  };
})()`;

const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];

const env: NodeJS.ProcessEnv = {
  ...process.env, NODE_ENV: 'test', DATABASE_URL: BENCH_URL, PORT: String(PORT), QUEUE_PREFIX: 'bench', WEB_DIST: DIST,
  LOG_LEVEL: 'warn', SIGNIN_IP_LIMIT: '1000',
};
// scripts/bench.sh builds once for every benchmark; run on its own, this file builds first.
if (process.env.BENCH_WEB_BUILT !== '1') {
  const built = spawnSync('npx', ['vite', 'build', '--outDir', DIST, '--emptyOutDir'], { stdio: ['ignore', 'ignore', 'inherit'] });
  if (built.status !== 0) throw new Error(`vite build exited ${built.status}`);
}
await prepareDatabase(env);
const api = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], { env, stdio: ['ignore', 'ignore', 'inherit'] });
try {
  await waitForHealth(api);
  const session = await signIn();
  const results = new Map<Profile, Load[]>(PROFILES.map((p) => [p, []]));
  // One discarded load per profile, then the profiles alternate so drift on a shared machine hits both alike.
  for (const p of PROFILES) await measure(p, session);
  for (let run = 0; run < RUNS; run++) for (const p of PROFILES) results.get(p)!.push(await measure(p, session));

  console.log(`caseload page (P8), headless Chromium, fresh profile per load, median of ${RUNS}; API serving ${path.relative(process.cwd(), DIST)}`);
  for (const [p, loads] of results) {
    const lcps = loads.map((l) => l.lcpMs);
    console.log(`  ${p.name}`);
    console.log(`    LCP ${(median(lcps) / 1000).toFixed(2)} s (target ≤ ${p.lcpTarget})   runs: ${lcps.map((v) => (v / 1000).toFixed(2)).join(' ')}`);
    console.log(`    CLS ${median(loads.map((l) => l.cls)).toFixed(3)} (target ≤ 0.05)   runs: ${loads.map((l) => l.cls.toFixed(3)).join(' ')}; sum of all shifts max ${Math.max(...loads.map((l) => l.shiftSum)).toFixed(3)}`);
    const fcp = median(loads.map((l) => l.fcpMs)) / 1000;
    const rows = median(loads.map((l) => l.rowsMs)) / 1000;
    console.log(`    FCP ${fcp.toFixed(2)} s; first row in the page ${rows.toFixed(2)} s; LCP element ${loads.at(-1)!.lcpElement}; ${median(loads.map((l) => l.requests))} requests`);
  }
  const origins = new Set([...results.values()].flat().flatMap((l) => l.origins));
  const foreign = [...origins].filter((o) => o !== BASE);
  console.log(`  origins at load: ${[...origins].join(', ')}; third-party: ${foreign.length ? foreign.join(', ') : 'none'}`);
} finally {
  api.kill('SIGTERM');
  if (api.exitCode === null) await new Promise((r) => api.once('exit', r));
}
process.exit(0);
