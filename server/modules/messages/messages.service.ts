import type { DataSource } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { SKIP_REASONS, type ListMessagesQuery, type Message, type MessagesPage, type SkipReason } from '@shared/schemas/messages';
import { DEFAULT_COUNTRY, isCountryCode, readPhone } from '@shared/phone/phone';
import { accessibleWhere, readsEveryInfantOf } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { keyValues } from '../../db/repositories/list-paging';
import { exportKeyOf, MESSAGE_SORT_KEYS, type MessageListRow, type ReminderRow } from '../../db/repositories/reminders.repository';
import { encodeCursor, pageCursors, positionOf, readingFrom } from '../../lib/cursor';
import { EXPORT_PAGE_ROWS } from '../../lib/csv';
import type { AppRepos } from '../../deps';
import type { JobProducer } from '../../jobs/producer';
import { ConflictError, ForbiddenError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';

function toDto(r: ReminderRow & { infant_name?: string | null }): Message {
  return {
    id: r.id, template: r.template, channel: r.channel, status: r.status,
    reason: r.reason ? (SKIP_REASONS[r.reason as SkipReason] ?? r.reason) : null,
    recipient: { kind: r.contact_id || !r.user_id ? 'family' : 'staff', name: r.recipient_name, address: r.to_address },
    infant: r.infant_id ? { id: r.infant_id, name: r.infant_name ?? '' } : null,
    sendAt: new Date(r.send_at).toISOString(), sentAt: r.sent_at ? new Date(r.sent_at).toISOString() : null,
    attempts: r.attempts, providerId: r.provider_id, lastError: r.last_error, createdAt: new Date(r.created_at).toISOString(),
  };
}

/** The check each message's baby needs for this caller, or null when the programme filter already is the check. */
const infantRights = (ability: AppAbility, programmeId: string) =>
  readsEveryInfantOf(ability, programmeId) ? null : accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS);

export function createMessagesService(ds: DataSource, repos: AppRepos, jobs: JobProducer) {
  return {
    async list(ability: AppAbility, programmeId: string, query: ListMessagesQuery, country: string = DEFAULT_COUNTRY): Promise<MessagesPage> {
      const phone = query.q && isCountryCode(country) ? readPhone(query.q, country, 'any') : null;
      const key = MESSAGE_SORT_KEYS[query.sort];
      const { from, at } = positionOf(query, query.sort, key.length - 1);
      const { rows, more, total, estimate } = await readingFrom(from, repos.reminders.list(query, programmeId, infantRights(ability, programmeId), at, phone?.ok ? phone.e164 : null));
      const cursorOf = (r: MessageListRow) => {
        const values = keyValues(key, r as unknown as Record<string, unknown>);
        return encodeCursor({ sort: query.sort, values: values.slice(0, -1), id: r.id });
      };
      return { items: rows.map(toDto), total, totalIsEstimate: estimate, ...pageCursors({ query, from, rows, more, cursorOf }) };
    },

    /** Every message the log's filters and search match (paging ignored), read a keyset page at a time in the list's order. */
    exportRows(ability: AppAbility, programmeId: string, query: ListMessagesQuery, country: string = DEFAULT_COUNTRY): AsyncIterable<Message> {
      const phone = query.q && isCountryCode(country) ? readPhone(query.q, country, 'any') : null;
      const acl = infantRights(ability, programmeId);
      return (async function* () {
        let after: string[] | undefined;
        for (;;) {
          const rows = await repos.reminders.exportPage(query, programmeId, acl, phone?.ok ? phone.e164 : null, after, EXPORT_PAGE_ROWS);
          for (const r of rows) yield toDto(r);
          if (rows.length < EXPORT_PAGE_ROWS) return;
          after = exportKeyOf(query.sort, rows.at(-1)!);
        }
      })();
    },

    /** A failed (or unknown-outcome) message goes again now, as a fresh attempt series; the ledger keeps what happened before. */
    async retry(ability: AppAbility, actor: Actor, id: string): Promise<Message> {
      const row = await ds.transaction(async (m) => {
        const r = await repos.reminders.lockForDelivery(id, m);
        if (!r || !ability.can('read', subject('Message', { programmeId: r.programme_id } as Record<string, unknown>))) throw new NotFoundError('No such message in your programme.');
        if (!ability.can('update', subject('Message', { programmeId: r.programme_id } as Record<string, unknown>))) throw new ForbiddenError('You cannot send messages again.');
        // 'unknown': a coordinator has checked that an uncertain e-mail did not arrive and chooses to send it again.
        if (r.status !== 'failed' && r.status !== 'unknown') throw new ConflictError(`Only a failed message, or one whose outcome is unknown, can be sent again (this one is ${r.status}).`);
        await repos.reminders.markDeliveryRetrying(id, m);
        await repos.reminders.update(id, { status: 'scheduled', send_at: new Date(), reason: null }, m);
        await repos.audit.append({ programmeId: r.programme_id, actorId: actor.id, action: 'message.retried', entityType: r.infant_id ? 'infant' : 'message', entityId: r.infant_id ?? r.id, ip: actor.ip, details: { messageId: r.id, template: r.template } }, m);
        return (await repos.reminders.findById(id, m))!;
      });
      await jobs.enqueueReminders([row]);
      const named = row.infant_id ? await repos.infants.fullName(row.infant_id) : undefined;
      return toDto({ ...row, infant_name: named?.name ?? null });
    },

    /**
     * A coordinator has checked with the family that an e-mail of unknown outcome did arrive: it is recorded as
     * sent (never sent again), and the decision is audited.
     */
    async confirmArrived(ability: AppAbility, actor: Actor, id: string): Promise<Message> {
      const row = await ds.transaction(async (m) => {
        const r = await repos.reminders.lockForDelivery(id, m);
        if (!r || !ability.can('read', subject('Message', { programmeId: r.programme_id } as Record<string, unknown>))) throw new NotFoundError('No such message in your programme.');
        if (!ability.can('update', subject('Message', { programmeId: r.programme_id } as Record<string, unknown>))) throw new ForbiddenError('You cannot settle messages.');
        if (r.status !== 'unknown') throw new ConflictError(`Only a message whose outcome is unknown can be marked as arrived (this one is ${r.status}).`);
        await repos.reminders.markDeliveryArrived(id, m);
        await repos.reminders.update(id, { status: 'sent', reason: null, sent_at: new Date() }, m);
        await repos.audit.append({ programmeId: r.programme_id, actorId: actor.id, action: 'message.confirmed-arrived', entityType: r.infant_id ? 'infant' : 'message', entityId: r.infant_id ?? r.id, ip: actor.ip, details: { messageId: r.id, template: r.template } }, m);
        return (await repos.reminders.findById(id, m))!;
      });
      const named = row.infant_id ? await repos.infants.fullName(row.infant_id) : undefined;
      return toDto({ ...row, infant_name: named?.name ?? null });
    },
  };
}
export type MessagesService = ReturnType<typeof createMessagesService>;
