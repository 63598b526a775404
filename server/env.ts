import { z } from 'zod';
import { DEFAULT_SMS_AUTH_TOKEN, DEFAULT_SMS_ACCOUNT_SID, productionProblems } from './env-production';

// The only place that reads process.env. Defaults make `npm start` work on a fresh machine with no .env.
const boolFromString = z
  .enum(['true', 'false', '1', '0'])
  .transform((v) => v === 'true' || v === '1');

// Empty means "not set": lets SMS_API_BASE= switch the SMS sender to the hosted service.
const optionalUrl = z.union([z.literal(''), z.url()]).optional();

export const envSchema = z
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
    // Sign-in limits: consecutive failures for one account from one address (blocks that pair only), every attempt
    // from one address, both per SIGNIN_WINDOW_SECONDS; and a slower limit on one account's failures from anywhere.
    SIGNIN_PAIR_LIMIT: z.coerce.number().int().min(1).default(5),
    SIGNIN_IP_LIMIT: z.coerce.number().int().min(1).default(30),
    SIGNIN_WINDOW_SECONDS: z.coerce.number().int().min(1).default(15 * 60),
    SIGNIN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(100),
    SIGNIN_ACCOUNT_WINDOW_SECONDS: z.coerce.number().int().min(1).default(24 * 3600),
    // Where links in e-mails point (set-up links); defaults to this server's own address.
    PUBLIC_URL: optionalUrl,
    SETUP_LINK_HOURS: z.coerce.number().int().min(1).max(24 * 14).default(72),
    // Signs the supplier's links to an equipment order (HMAC-SHA256); required in production. Changing it ends every
    // link already sent. SUPPLIER_LINK_DAYS: how long after the date needed a link keeps working.
    SUPPLIER_LINK_SECRET: z.string().min(32).optional(),
    SUPPLIER_LINK_DAYS: z.coerce.number().int().min(1).max(90).default(14),
    WEB_DIST: z.string().default('dist/web'),
    LOG_LEVEL: z.enum(['debug', 'info', 'warn', 'error', 'silent']).default('info'),
    // Defaults point the senders at the local fakes (fakes/mail, fakes/sms); real credentials reach the hosted ones.
    SMTP_HOST: z.string().min(1).default('127.0.0.1'),
    // Unset: the local fake's port (FAKE_SMTP_PORT) outside production, the submission port in production.
    SMTP_PORT: z.coerce.number().int().min(1).max(65535).optional(),
    SMTP_SECURE: boolFromString.default(false),
    SMTP_USER: z.string().min(1).optional(),
    SMTP_PASS: z.string().min(1).optional(),
    MAIL_FROM: z.string().min(3).default('Nestflow <no-reply@nestflow.example>'),
    TWILIO_ACCOUNT_SID: z.string().regex(/^AC[0-9a-fA-F]{32}$/).default(DEFAULT_SMS_ACCOUNT_SID),
    TWILIO_AUTH_TOKEN: z.string().min(8).default(DEFAULT_SMS_AUTH_TOKEN),
    TWILIO_FROM: z.string().min(3).default('+15005550006'),
    // Unset: the local fake (FAKE_SMS_PORT) outside production, the hosted service in production.
    SMS_API_BASE: optionalUrl,
    // Where an e-mail attempt of unknown outcome is looked up by Message-ID (server/notifications/mail-search.ts).
    // Unset: the local fake's search outside production, none in production (such e-mails wait for a coordinator).
    MAIL_SEARCH_URL: optionalUrl,
    FAKE_MAIL_HTTP_PORT: z.coerce.number().int().min(0).max(65535).default(3101),
    FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2526),
    FAKE_SMS_PORT: z.coerce.number().int().min(0).max(65535).default(3102),
    // Where the fakes keep what they received (npm start: .data/fakes), so a restarted fake loses nothing; empty: memory.
    FAKE_INBOX_DIR: z.string().default(''),
    INBOUND_WEBHOOK_URL: optionalUrl,
    // Message delivery: attempts per message (exponential backoff from the base delay), how often the reconciler
    // looks for due messages in PostgreSQL, and how many go out at once per worker.
    REMINDER_ATTEMPTS: z.coerce.number().int().min(1).max(20).default(6),
    REMINDER_BACKOFF_MS: z.coerce.number().int().min(10).max(3_600_000).default(30_000),
    REMINDER_RECONCILE_MS: z.coerce.number().int().min(200).max(3_600_000).default(30_000),
    REMINDER_CONCURRENCY: z.coerce.number().int().min(1).max(100).default(8),
    SEND_TIMEOUT_MS: z.coerce.number().int().min(100).max(120_000).default(10_000),
  });

type Parsed = z.infer<typeof envSchema>;
export type Env = Omit<Parsed, 'SMTP_PORT' | 'SMS_API_BASE' | 'MAIL_SEARCH_URL'> & {
  SESSION_SECRET: string;
  SUPPLIER_LINK_SECRET: string;
  COOKIE_SECURE: boolean;
  SMTP_PORT: number;
  /** Empty: the hosted SMS service. */
  SMS_API_BASE: string;
  /** Empty: no mail search; an uncertain e-mail is held for a coordinator. */
  MAIL_SEARCH_URL: string;
  PUBLIC_URL: string;
};

/** The configuration, or every problem with it (each naming its variable). Pure, so it is tested directly. */
export function parseEnv(source: NodeJS.ProcessEnv): { env: Env; problems?: undefined } | { env?: undefined; problems: string[] } {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) return { problems: parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) };
  const env = parsed.data;
  const production = env.NODE_ENV === 'production';
  if (production) {
    const problems = productionProblems(source, env);
    if (problems.length) return { problems };
  }
  // Outside production the senders follow the fakes wherever they were told to listen (npm start with other ports).
  const fake = (port: number) => `http://127.0.0.1:${port}`;
  return {
    env: {
      ...env,
      // A fixed development secret is acceptable only because production refuses to start without one.
      SESSION_SECRET: env.SESSION_SECRET ?? 'nestflow-development-only-session-secret-0000',
      SUPPLIER_LINK_SECRET: env.SUPPLIER_LINK_SECRET ?? 'nestflow-development-only-supplier-link-secret',
      COOKIE_SECURE: env.COOKIE_SECURE ?? production,
      SMTP_PORT: env.SMTP_PORT ?? (production ? (env.SMTP_SECURE ? 465 : 587) : env.FAKE_SMTP_PORT),
      SMS_API_BASE: env.SMS_API_BASE ?? (production ? '' : fake(env.FAKE_SMS_PORT)),
      MAIL_SEARCH_URL: env.MAIL_SEARCH_URL ?? (production ? '' : fake(env.FAKE_MAIL_HTTP_PORT)),
      PUBLIC_URL: (env.PUBLIC_URL || `http://${env.HOST}:${env.PORT}`).replace(/\/+$/, ''),
    },
  };
}

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const result = parseEnv(source);
  if (result.problems) {
    console.error(`Nestflow cannot start: bad configuration\n${result.problems.map((p) => `  - ${p}`).join('\n')}`);
    process.exit(1);
  }
  return result.env;
}
