import { z } from 'zod';

// The only place that reads process.env. Defaults make `npm start` work on a fresh machine with no .env.
const boolFromString = z
  .enum(['true', 'false', '1', '0'])
  .transform((v) => v === 'true' || v === '1');

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(1).max(65535).default(3000),
    DATABASE_URL: z.url().default('postgres://postgres@127.0.0.1:54329/nestflow'),
    REDIS_URL: z.url().default('redis://127.0.0.1:63799'),
    QUEUE_PREFIX: z.string().regex(/^[a-z0-9-]+$/).default('nestflow'),
    SESSION_SECRET: z.string().min(32).optional(),
    SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(30),
    SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).max(72).default(12),
    COOKIE_SECURE: boolFromString.optional(),
    TRUST_PROXY: boolFromString.default(false),
    SIGNIN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(5),
    SIGNIN_IP_LIMIT: z.coerce.number().int().min(1).default(30),
    SIGNIN_WINDOW_SECONDS: z.coerce.number().int().min(1).default(15 * 60),
    WEB_DIST: z.string().default('dist/web'),
    LOG_LEVEL: z.enum(['debug', 'info', 'warn', 'error', 'silent']).default('info'),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'is required in production (32+ characters)' });
    }
  });

export type Env = z.infer<typeof envSchema> & { SESSION_SECRET: string; COOKIE_SECURE: boolean };

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  - ${i.path.join('.')}: ${i.message}`);
    console.error(`Nestflow cannot start: bad configuration\n${lines.join('\n')}`);
    process.exit(1);
  }
  const env = parsed.data;
  return {
    ...env,
    // A fixed development secret is acceptable only because production refuses to start without one.
    SESSION_SECRET: env.SESSION_SECRET ?? 'nestflow-development-only-session-secret-0000',
    COOKIE_SECURE: env.COOKIE_SECURE ?? env.NODE_ENV === 'production',
  };
}
