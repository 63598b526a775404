import { randomUUID } from 'node:crypto';
import type { MessageStatus, MessageTemplate } from '@shared/schemas/messages';
import type { AppDeps } from '../../server/deps';
import type { ReminderRow } from '../../server/db/repositories/reminders.repository';
import { createDelivery } from '../../server/modules/reminders/delivery';
import type { MailMessage } from '../../server/notifications/mail-sender';
import type { SmsMessage } from '../../server/notifications/sms-sender';

/** A reminder row as the repository returns it, for code that only reads it (rendering, message content). */
export function reminderRow(template: MessageTemplate, data: Record<string, unknown>, over: Partial<ReminderRow> = {}): ReminderRow {
  return {
    id: randomUUID(), programme_id: randomUUID(), infant_id: randomUUID(), visit_id: null, template, contact_id: randomUUID(), user_id: null,
    recipient_name: 'Rowan Ashby', channel: 'sms', to_address: '+447700900001', language: 'en', time_zone: 'Europe/London', data,
    dedupe_key: `test-${randomUUID()}`, send_at: new Date('2026-12-02T17:00:00Z'), not_after: null, status: 'scheduled', reason: null, attempts: 0,
    provider_id: null, last_error: null, sent_at: null, created_at: new Date('2026-11-30T12:00:00Z'), ...over,
  };
}

/**
 * The delivery service with senders that only record what they were asked to send: for tests about what the
 * service decides (consent, opt-out, quiet hours), not about the senders themselves.
 */
export function stubDelivery(deps: AppDeps) {
  const mails: MailMessage[] = [];
  const texts: SmsMessage[] = [];
  let n = 0;
  const delivery = createDelivery({
    ds: deps.ds, repos: deps.repos, logger: deps.logger, enqueue: async () => undefined,
    mail: { send: async (msg) => (mails.push(msg), { providerId: `stub-mail-${(n += 1)}` }), close: () => undefined },
    sms: { send: async (msg) => (texts.push(msg), { providerId: `stub-sms-${(n += 1)}` }), findSent: async () => null },
  });
  return { delivery, mails, texts };
}

/** A reminder row written straight to the table, for states the API cannot reach on demand (a failed delivery). */
export async function insertReminder(
  deps: AppDeps,
  r: { programmeId: string; infantId?: string | null; template?: MessageTemplate; status?: MessageStatus; sendAt?: Date; lastError?: string | null; recipientName?: string },
): Promise<string> {
  const [row] = await deps.ds.query(
    `INSERT INTO reminders (programme_id, infant_id, template, recipient_name, channel, to_address, time_zone, dedupe_key, send_at, status, last_error, attempts)
     VALUES ($1, $2, $3, $4, 'sms', '+447700900001', 'Europe/London', $5, $6, $7, $8, $9) RETURNING id`,
    [r.programmeId, r.infantId ?? null, r.template ?? 'visit-day-before', r.recipientName ?? 'Parent One', `test-${randomUUID()}`, r.sendAt ?? new Date(Date.now() - 3_600_000),
      r.status ?? 'failed', r.lastError ?? (r.status && r.status !== 'failed' ? null : 'Provider said no'), r.status === 'scheduled' ? 0 : 1],
  );
  return row.id;
}
