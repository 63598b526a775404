import nodemailer from 'nodemailer';
import type { Env } from '../env';
import { PermanentSendError, TemporarySendError } from './errors';

export type MailEnv = Pick<Env, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASS' | 'MAIL_FROM'>;

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Fixed per reminder, so a repeat after an attempt of unknown outcome is the same message to the recipient's system. */
  messageId?: string;
  /** Files sent with the message (the discharge letter's or an equipment order's PDF). */
  attachments?: Array<{ filename: string; content: Buffer; contentType: string }>;
}

export interface MailSender {
  send(message: MailMessage): Promise<{ providerId: string }>;
  close(): void;
}

// A provider that neither answers nor drops the connection must not hold a worker slot for minutes.
const DEFAULT_TIMEOUT_MS = 10_000;

function classify(err: unknown): Error {
  const responseCode = (err as { responseCode?: unknown }).responseCode;
  const code = (err as { code?: unknown }).code;
  const providerCode = typeof responseCode === 'number' ? responseCode : typeof code === 'string' ? code : undefined;
  const reason = err instanceof Error ? err.message : String(err);
  // SMTP 5yz replies are final; 4yz replies, dropped connections and time-outs are worth another attempt.
  if (typeof responseCode === 'number' && responseCode >= 500) {
    return new PermanentSendError(`Mail rejected: ${reason}`, { providerCode, cause: err });
  }
  return new TemporarySendError(`Mail not delivered yet: ${reason}`, { providerCode, cause: err });
}

export function createMailSender(env: MailEnv, opts: { timeoutMs?: number } = {}): MailSender {
  const timeout = opts.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const auth = env.SMTP_USER && env.SMTP_PASS ? { user: env.SMTP_USER, pass: env.SMTP_PASS } : undefined;
  const transport = nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    // The local fake speaks plain SMTP only. Credentials, though, are never sent in the clear: with them a
    // non-implicit-TLS connection must upgrade through STARTTLS.
    ignoreTLS: !env.SMTP_SECURE && !auth,
    requireTLS: !env.SMTP_SECURE && !!auth,
    auth,
    connectionTimeout: timeout,
    greetingTimeout: timeout,
    socketTimeout: timeout,
  });

  return {
    async send(message) {
      try {
        const info = await transport.sendMail({
          from: env.MAIL_FROM,
          to: message.to,
          subject: message.subject,
          text: message.text,
          html: message.html,
          messageId: message.messageId,
          attachments: message.attachments,
        });
        return { providerId: info.messageId };
      } catch (err) {
        throw classify(err);
      }
    },
    close: () => transport.close(),
  };
}
