import 'reflect-metadata';
import type { Express } from 'express';
import { loadEnv, type Env } from '../../server/env';
import { closeDeps, createDeps, type AppDeps } from '../../server/deps';
import { createApp } from '../../server/app';

export interface TestContext {
  deps: AppDeps;
  app: Express;
  close(): Promise<void>;
}

/** A real app on the real test database and Redis; `overrides` tune limits for a single test file. */
export async function createTestContext(overrides: Partial<Record<keyof Env, string>> = {}, extra: Pick<AppDeps, 'clock'> = {}): Promise<TestContext> {
  const env = loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    SIGNIN_IP_LIMIT: '100000',
    QUEUE_PREFIX: `t${Math.random().toString(36).slice(2, 10)}`,
    ...overrides,
  });
  const deps: AppDeps = { ...(await createDeps(env, 'test')), ...extra };
  return { deps, app: createApp(deps), close: () => closeDeps(deps) };
}
