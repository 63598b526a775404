import twilio from 'twilio';
import type RequestClient from 'twilio/lib/base/RequestClient';
import type { Env } from '../env';
import { PermanentSendError, TemporarySendError } from './errors';

export type SmsEnv = Pick<Env, 'TWILIO_ACCOUNT_SID' | 'TWILIO_AUTH_TOKEN' | 'TWILIO_FROM' | 'SMS_API_BASE'>;

export interface SmsMessage {
  to: string;
  body: string;
}

export interface SmsSender {
  send(message: SmsMessage): Promise<{ providerId: string }>;
  /**
   * The provider's own record of a message with this body to this number since a moment: how an attempt whose
   * outcome is unknown (the worker died after sending, a time-out) is settled without sending twice.
   */
  findSent(message: SmsMessage, since: Date): Promise<{ providerId: string } | null>;
}

const DEFAULT_TIMEOUT_MS = 10_000;

// The SDK has no base-URL setting, so this swaps only the origin; auth header, form body and user agent stay
// the SDK's own, which is what lets the local fake stand in for the hosted API.
class OriginRewritingRequestClient extends twilio.RequestClient {
  private readonly origin: string;

  constructor(baseUrl: string, opts: RequestClient.RequestClientOptions) {
    super(opts);
    this.origin = new URL(baseUrl).origin;
  }

  request<TData>(opts: RequestClient.RequestOptions<TData>) {
    const target = new URL(opts.uri);
    return super.request<TData>({ ...opts, uri: `${this.origin}${target.pathname}${target.search}` });
  }
}

function classify(err: unknown): Error {
  const status = (err as { status?: unknown }).status;
  const code = (err as { code?: unknown }).code;
  const providerCode = typeof code === 'number' || typeof code === 'string' ? code : undefined;
  const reason = err instanceof Error ? err.message : String(err);
  // 429 is the provider asking us to slow down, not a verdict on the message.
  if (typeof status === 'number' && status >= 400 && status < 500 && status !== 429) {
    return new PermanentSendError(reason, { providerCode, cause: err });
  }
  return new TemporarySendError(`SMS not delivered yet: ${reason}`, { providerCode, cause: err });
}

export function createSmsSender(env: SmsEnv, opts: { timeoutMs?: number } = {}): SmsSender {
  const timeout = opts.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const httpClient = env.SMS_API_BASE
    ? new OriginRewritingRequestClient(env.SMS_API_BASE, { timeout })
    : new twilio.RequestClient({ timeout });
  const client = twilio(env.TWILIO_ACCOUNT_SID, env.TWILIO_AUTH_TOKEN, { httpClient });

  return {
    async send({ to, body }) {
      try {
        const message = await client.messages.create({ to, from: env.TWILIO_FROM, body });
        return { providerId: message.sid };
      } catch (err) {
        throw classify(err);
      }
    },
    async findSent({ to, body }, since) {
      try {
        // The provider filters by sent date at day granularity; the exact moment and body are checked here.
        const day = new Date(Date.UTC(since.getUTCFullYear(), since.getUTCMonth(), since.getUTCDate()));
        const found = await client.messages.list({ to, from: env.TWILIO_FROM, dateSentAfter: day, pageSize: 100, limit: 500 });
        const match = found.find((m) => m.body === body && (m.dateCreated ? m.dateCreated.getTime() >= since.getTime() - 60_000 : true));
        return match ? { providerId: match.sid } : null;
      } catch (err) {
        throw classify(err);
      }
    },
  };
}
