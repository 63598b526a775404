import 'reflect-metadata';
import type { Express } from 'express';
import { loadEnv, type Env } from '../../server/env';
import { closeDeps, createDeps, type AppDeps } from '../../server/deps';
import { createApp } from '../../server/app';
import type { Clock } from '../../server/lib/clock';
import { startFakeMail, type FakeMail } from '../../fakes/mail/app';

export interface TestContext {
  deps: AppDeps;
  app: Express;
  /** The local mail fake the app's own e-mails (set-up links, account notices) go to. */
  mail: FakeMail;
  close(): Promise<void>;
}

/** A real app on the real test database and Redis; `overrides` tune limits for a single test file. */
export async function createTestContext(overrides: Partial<Record<keyof Env, string>> = {}, opts: { now?: () => Date; clock?: Clock } = {}): Promise<TestContext> {
  const mail = await startFakeMail({ smtpPort: 0, httpPort: 0 });
  const env = loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    SIGNIN_IP_LIMIT: '100000',
    QUEUE_PREFIX: `t${Math.random().toString(36).slice(2, 10)}`,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(mail.smtpPort),
    PUBLIC_URL: 'http://nestflow.test',
    ...overrides,
  });
  const deps = await createDeps(env, 'test');
  if (opts.now) deps.now = opts.now;
  if (opts.clock) deps.clock = opts.clock;
  return {
    deps,
    app: createApp(deps),
    mail,
    close: async () => {
      await closeDeps(deps);
      await mail.close();
    },
  };
}
