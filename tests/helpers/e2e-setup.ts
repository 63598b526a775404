import 'reflect-metadata';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import type { TestProject } from 'vitest/node';
import { createDataSource } from '../../server/db/data-source';

const PORT = Number(process.env.E2E_PORT ?? 3310);
let children: ChildProcess[] = [];

async function waitForHealth(url: string, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`E2E server did not become healthy at ${url}`);
}

const run = (args: string[], env: NodeJS.ProcessEnv) =>
  new Promise<void>((resolve, reject) => {
    const p = spawn(process.execPath, ['--import', 'tsx', ...args], { env, stdio: 'inherit' });
    p.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`${args.join(' ')} exited ${code}`))));
  });

/** A clean database with the demo scenario, and the real API + worker as separate processes, like `npm start`. */
export default async function setup(project: TestProject) {
  const url = process.env.E2E_DATABASE_URL;
  if (!url || !/_e2e\b/.test(url)) throw new Error(`Refusing to reset a database that is not the e2e database: ${url}`);
  if (!existsSync('dist/web/index.html')) throw new Error('dist/web is missing: run `npx vite build` first (npm test does)');
  const ds = createDataSource(url);
  await ds.initialize();
  await ds.query('DROP SCHEMA IF EXISTS public CASCADE');
  await ds.query('CREATE SCHEMA public');
  await ds.destroy();
  // The fake mail and SMS servers run beside the API, on ports next to it, as `npm start` runs them.
  // E2E_FAKE_*_PORT move them where ports next to the API are taken (several test runs on one machine).
  const fakes = {
    FAKE_MAIL_HTTP_PORT: process.env.E2E_FAKE_MAIL_HTTP_PORT ?? String(PORT + 1),
    FAKE_SMTP_PORT: process.env.E2E_FAKE_SMTP_PORT ?? String(PORT + 2),
    FAKE_SMS_PORT: process.env.E2E_FAKE_SMS_PORT ?? String(PORT + 3),
  };
  const env = {
    ...process.env, NODE_ENV: 'test', DATABASE_URL: url, PORT: String(PORT), QUEUE_PREFIX: 'e2e', LOG_LEVEL: 'warn', SIGNIN_IP_LIMIT: '1000', ...fakes,
    SMTP_PORT: fakes.FAKE_SMTP_PORT, SMS_API_BASE: `http://127.0.0.1:${fakes.FAKE_SMS_PORT}`, INBOUND_WEBHOOK_URL: `http://127.0.0.1:${PORT}/api/webhooks/sms`,
    REMINDER_RECONCILE_MS: '2000',
  };
  await run(['server/db/migrate.ts'], env);
  await run(['seed/main.ts'], env);
  children = [
    spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], { env, stdio: 'inherit' }),
    spawn(process.execPath, ['--import', 'tsx', 'worker/main.ts'], { env, stdio: 'inherit' }),
    spawn(process.execPath, ['--import', 'tsx', 'fakes/mail/main.ts'], { env, stdio: 'inherit' }),
    spawn(process.execPath, ['--import', 'tsx', 'fakes/sms/main.ts'], { env, stdio: 'inherit' }),
  ];
  await waitForHealth(`http://127.0.0.1:${PORT}/api/health`, 30_000);
  await waitForHealth(`http://127.0.0.1:${fakes.FAKE_SMS_PORT}/health`, 30_000);
  await waitForHealth(`http://127.0.0.1:${fakes.FAKE_MAIL_HTTP_PORT}/health`, 30_000);
  project.provide('baseUrl', `http://127.0.0.1:${PORT}`);
  project.provide('fakeSmsUrl', `http://127.0.0.1:${fakes.FAKE_SMS_PORT}`);
  project.provide('fakeMailUrl', `http://127.0.0.1:${fakes.FAKE_MAIL_HTTP_PORT}`);
  return async () => {
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(children.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : c.once('exit', r)))));
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    fakeSmsUrl: string;
    fakeMailUrl: string;
  }
}
