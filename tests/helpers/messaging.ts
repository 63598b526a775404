import { Queue, Worker } from 'bullmq';
import { startFakeMail, type FakeMail } from '../../fakes/mail/app';
import { startFakeSms, type FakeSms } from '../../fakes/sms/app';
import { QUEUES, reminderJobId } from '@shared/jobs/catalogue';
import type { PolicySettings } from '@shared/schemas/policy';
import type { AppDeps } from '../../server/deps';
import { addReminderJobs } from '../../server/jobs/reminder-jobs';
import { createDelivery, type Delivery } from '../../server/modules/reminders/delivery';
import { createMailSender } from '../../server/notifications/mail-sender';
import { createSmsSender } from '../../server/notifications/sms-sender';
import { createHttpMailSearch } from '../../server/notifications/mail-search';
import { redisConnection } from '../../worker/queues';
import { deliverReminderProcessor } from '../../worker/processors/deliver-reminder.processor';

export interface Messaging {
  mail: FakeMail;
  sms: FakeSms;
  delivery: Delivery;
  queue: Queue;
  worker: Worker;
  jobOptions: { attempts: number; backoffMs: number };
  close(): Promise<void>;
}

/**
 * Both fakes on free loopback ports, the real senders (nodemailer, the twilio SDK) pointed at them, and a BullMQ
 * worker on the real messages queue under the test app's prefix: the same path the worker process runs.
 */
export async function startMessaging(deps: AppDeps, opts: { attempts?: number; backoffMs?: number; timeoutMs?: number; mailSearch?: boolean; clock?: () => Date } = {}): Promise<Messaging> {
  const env = deps.env;
  const mail = await startFakeMail({ smtpPort: 0, httpPort: 0 });
  const sms = await startFakeSms({ port: 0, accountSid: env.TWILIO_ACCOUNT_SID, authToken: env.TWILIO_AUTH_TOKEN, ourNumber: env.TWILIO_FROM });
  const senderEnv = { ...env, SMTP_HOST: '127.0.0.1', SMTP_PORT: mail.smtpPort, SMTP_SECURE: false, SMTP_USER: undefined, SMTP_PASS: undefined, SMS_API_BASE: `http://127.0.0.1:${sms.port}` };
  const mailSender = createMailSender(senderEnv, { timeoutMs: opts.timeoutMs ?? 1000 });
  const smsSender = createSmsSender(senderEnv, { timeoutMs: opts.timeoutMs ?? 1000 });
  const connection = redisConnection(env.REDIS_URL);
  const prefix = env.QUEUE_PREFIX;
  const queue = new Queue(QUEUES.messages, { connection, prefix });
  const jobOptions = { attempts: opts.attempts ?? 4, backoffMs: opts.backoffMs ?? 50 };
  // The fake's message search stands in for the mail service's; `mailSearch: false` is a deployment without one.
  const mailSearch = opts.mailSearch === false ? null : createHttpMailSearch(`http://127.0.0.1:${mail.httpPort}`, { timeoutMs: opts.timeoutMs ?? 1000 });
  const delivery = createDelivery({ ds: deps.ds, repos: deps.repos, mail: mailSender, sms: smsSender, mailSearch, clock: opts.clock, logger: deps.logger, enqueue: (rows) => addReminderJobs(queue, rows, jobOptions),
    inFlightGuardMs: 3 * (opts.timeoutMs ?? 1000) });
  const worker = new Worker(QUEUES.messages, (job) => deliverReminderProcessor(job, delivery), { connection, prefix, concurrency: 4 });
  await worker.waitUntilReady();
  return {
    mail, sms, delivery, queue, worker, jobOptions,
    async close() {
      await worker.close();
      await queue.close();
      mailSender.close();
      await Promise.all([mail.close(), sms.close()]);
    },
  };
}

/** "Time passes" for rows already queued with a delay (a coordinators' alert waits for its period to end). */
export async function bringForward(deps: AppDeps, queue: Queue, ids: string[]) {
  await deps.ds.query(`UPDATE reminders SET send_at = now() WHERE id = ANY($1)`, [ids]);
  for (const id of ids) {
    const job = await queue.getJob(reminderJobId(id));
    if (job && (await job.isDelayed())) await job.promote();
  }
}

/** A programme policy with quiet hours switched off, so a test can deliver "now" at any hour of the day. */
export async function policyWithoutQuietHours(deps: AppDeps, programmeId: string, change: (s: PolicySettings) => PolicySettings = (s) => s) {
  const current = await deps.repos.policies.current(programmeId);
  const settings = change({ ...current.settings, reminders: { ...current.settings.reminders, quietStart: '00:00', quietEnd: '00:00' } });
  await deps.repos.policies.insertVersion(programmeId, current.version + 1, settings, null);
  return settings;
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000, everyMs = 50): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

let nextMobile = 500;
/**
 * A different mobile for each family of a test file (the fakes' inboxes are per file), in Ofcom's drama range
 * 07700 900000–900999, which the phone reader accepts as a mobile that is nobody's.
 */
export function testMobile(): string {
  nextMobile = nextMobile >= 999 ? 500 : nextMobile + 1;
  return `+447700900${nextMobile}`;
}
