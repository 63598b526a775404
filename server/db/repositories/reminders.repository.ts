import type { DataSource, EntityManager } from 'typeorm';
import type { Channel, ListMessagesQuery, MessageStatus, MessageTemplate } from '@shared/schemas/messages';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { containsPattern, cutPage, keysetPageSql, pageAndCount, reversed, type KeyPart, type KeysetPosition } from './list-paging';
import { createRowEstimates } from './row-estimates';
import { fullNameSql } from './infants.repository';

export interface ReminderRow {
  id: string;
  programme_id: string;
  infant_id: string | null;
  visit_id: string | null;
  template: MessageTemplate;
  contact_id: string | null;
  user_id: string | null;
  recipient_name: string;
  channel: Channel | null;
  to_address: string | null;
  language: string;
  time_zone: string;
  data: Record<string, unknown>;
  dedupe_key: string;
  send_at: Date;
  not_after: Date | null;
  status: MessageStatus;
  reason: string | null;
  attempts: number;
  provider_id: string | null;
  last_error: string | null;
  sent_at: Date | null;
  created_at: Date;
}

export interface NewReminder {
  programmeId: string;
  infantId?: string | null;
  visitId?: string | null;
  template: MessageTemplate;
  contactId?: string | null;
  userId?: string | null;
  recipientName: string;
  channel?: Channel | null;
  toAddress?: string | null;
  language?: string;
  timeZone: string;
  data?: Record<string, unknown>;
  dedupeKey: string;
  sendAt: Date;
  notAfter?: Date | null;
  status?: 'scheduled' | 'skipped';
  reason?: string | null;
}

export interface DeliveryRow {
  reminder_id: string;
  state: 'sending' | 'retrying' | 'sent' | 'failed';
  channel: Channel;
  to_address: string;
  attempts: number;
  started_at: Date;
  provider_id: string | null;
}

const COLUMNS = ['programme_id', 'infant_id', 'visit_id', 'template', 'contact_id', 'user_id', 'recipient_name', 'channel', 'to_address', 'language', 'time_zone', 'data', 'dedupe_key', 'send_at', 'not_after', 'status', 'reason'];

// The message log's sorts, each ending in the id so no two rows tie (list-paging.ts). By status: statuses in order,
// newest first within one. Each is read from an index of migration MessageAndPeopleListIndexes.
const SEND_AT: KeyPart = { expr: 'r.send_at', dir: 'ASC', cast: 'timestamptz', text: 'k_send_at', out: 'send_at' };
const ID: KeyPart = { expr: 'r.id', dir: 'ASC', cast: 'uuid', text: 'id', out: 'id' };
const STATUS: KeyPart = { expr: 'r.status', dir: 'ASC', cast: 'text', text: 'status', out: 'status' };
const newest = [{ ...SEND_AT, dir: 'DESC' as const }, { ...ID, dir: 'DESC' as const }];
export const MESSAGE_SORT_KEYS: Record<ListMessagesQuery['sort'], KeyPart[]> = {
  sendAt: [SEND_AT, ID],
  '-sendAt': reversed([SEND_AT, ID]),
  status: [STATUS, ...newest],
  '-status': [{ ...STATUS, dir: 'DESC' }, ...newest],
};

export type MessageListRow = ReminderRow & { infant_name: string | null; k_send_at: string };
/** The message log's filters as SQL: the caller's rights on the baby, the programme, the chosen filters and the search. */
/**
 * The log's filters. `infantAcl` is the caller's right to read babies, checked on every message about a baby; null
 * when the caller may read every baby of `programmeId`: a message about a baby belongs to that baby's programme (a
 * foreign key, migration ReminderProgrammeMatchesInfant), so the programme filter is then the whole check.
 */
function logFilter(query: Omit<ListMessagesQuery, 'page' | 'pageSize'>, programmeId: string, infantAcl: SqlFilter | null, qPhone: string | null, rights: 'join' | 'exists' = 'join') {
  const named: Record<string, unknown> = { ...infantAcl?.params, programmeId };
  // 'join': used with `LEFT JOIN infants i ON i.id = r.infant_id`, the join that names the baby also checks the caller
  // may read it (a page of 26 rows: 26 key lookups). 'exists': the same check as a lookup per message, for the count.
  const where = [`r.programme_id = :programmeId`];
  if (infantAcl) {
    const rightsSql = rights === 'join' ? `(${infantAcl.sql})` : `EXISTS (SELECT 1 FROM infants i WHERE i.id = r.infant_id AND ${infantAcl.sql})`;
    where.push(`(r.infant_id IS NULL OR ${rightsSql})`);
  }
  for (const key of ['status', 'channel', 'template', 'infantId'] as const) {
    if (query[key]) {
      named[key] = query[key];
      where.push(`r.${key === 'infantId' ? 'infant_id' : key} = :${key}`);
    }
  }
  if (query.q) {
    // Matched as plain text: LIKE's own wildcards in what was typed are escaped. Each alternative is on the message
    // itself so each can be read from an index (migrations InfantNameSearchIndex, MessageSearchIndexes): the babies
    // of the programme whose name matches, through the same expression as the caseload's search, then their
    // messages; the recipient's name; the address (or the number typed in national form).
    named.q = containsPattern(query.q);
    const phone = qPhone ? ` OR r.to_address = :qPhone` : '';
    if (qPhone) named.qPhone = qPhone;
    where.push(`(r.infant_id = ANY (ARRAY(SELECT s.id FROM infants s WHERE s.programme_id = :programmeId AND ${fullNameSql('s')} ILIKE :q))
      OR r.recipient_name ILIKE :q OR r.to_address ILIKE :q${phone})`);
  }
  return { where, named };
}

// An export walks the log by keyset in the list's order, with the id last so every row has one place. Each key is
// read back as exact text (a timestamp keeps its microseconds) and cast back for the comparison.
const EXPORT_KEYS: Record<ListMessagesQuery['sort'], Array<{ col: string; alias: string; cast: string; dir: 'ASC' | 'DESC' }>> = {
  sendAt: [{ col: 'r.send_at', alias: 'k_send_at', cast: 'timestamptz', dir: 'ASC' }, { col: 'r.id', alias: 'k_id', cast: 'uuid', dir: 'ASC' }],
  '-sendAt': [{ col: 'r.send_at', alias: 'k_send_at', cast: 'timestamptz', dir: 'DESC' }, { col: 'r.id', alias: 'k_id', cast: 'uuid', dir: 'DESC' }],
  status: [{ col: 'r.status', alias: 'k_status', cast: 'text', dir: 'ASC' }, { col: 'r.send_at', alias: 'k_send_at', cast: 'timestamptz', dir: 'DESC' }, { col: 'r.id', alias: 'k_id', cast: 'uuid', dir: 'DESC' }],
  '-status': [{ col: 'r.status', alias: 'k_status', cast: 'text', dir: 'DESC' }, { col: 'r.send_at', alias: 'k_send_at', cast: 'timestamptz', dir: 'DESC' }, { col: 'r.id', alias: 'k_id', cast: 'uuid', dir: 'DESC' }],
};

export type MessageExportRow = ReminderRow & { infant_name: string | null; k_send_at: string; k_status: string; k_id: string };

/** A row's position in an export's order: its sort keys as exact text. */
export const exportKeyOf = (sort: ListMessagesQuery['sort'], row: MessageExportRow): string[] =>
  EXPORT_KEYS[sort].map((k) => String(row[k.alias as 'k_send_at' | 'k_status' | 'k_id']));

export function createRemindersRepository(ds: DataSource) {
  const estimateRows = createRowEstimates(ds);
  const q = (m?: EntityManager) => m ?? ds.manager;
  return {
    /** A coordinator sends a failed (or unknown) message again: its ledger row allows a new attempt. */
    markDeliveryRetrying: (reminderId: string, m: EntityManager): Promise<unknown> =>
      q(m).query(`UPDATE deliveries SET state = 'retrying' WHERE reminder_id = $1`, [reminderId]),

    /** A coordinator confirmed with the family that a message of unknown outcome arrived: its ledger row is settled as sent. */
    markDeliveryArrived: (reminderId: string, m: EntityManager): Promise<unknown> =>
      q(m).query(`UPDATE deliveries SET state = 'sent', finished_at = now() WHERE reminder_id = $1`, [reminderId]),

    /** Inserts many in one statement; a row whose dedupe key exists already is left as it is. Returns the new rows' ids and send times. */
    async insertMany(rows: NewReminder[], m: EntityManager): Promise<Array<{ id: string; send_at: Date; status: string }>> {
      if (rows.length === 0) return [];
      const params: unknown[] = [];
      const tuples = rows.map((r) => {
        const values = [r.programmeId, r.infantId ?? null, r.visitId ?? null, r.template, r.contactId ?? null, r.userId ?? null, r.recipientName,
          r.channel ?? null, r.toAddress ?? null, r.language ?? 'en', r.timeZone, JSON.stringify(r.data ?? {}), r.dedupeKey, r.sendAt, r.notAfter ?? null,
          r.status ?? 'scheduled', r.reason ?? null];
        return `(${values.map((v) => `$${params.push(v)}`).join(',')})`;
      });
      return q(m).query(
        `INSERT INTO reminders (${COLUMNS.join(',')}) VALUES ${tuples.join(',')} ON CONFLICT (dedupe_key) DO NOTHING RETURNING id, send_at, status`,
        params,
      );
    },

    /**
     * Adds one item to a gathered alert (data.failures), creating the alert if needed. An alert whose delivery has
     * begun (it has a ledger row) or ended is left alone: null, and the caller tries the next period's.
     */
    appendToAlert: async (a: { programmeId: string; userId: string; name: string; email: string; timeZone: string; item: unknown; dedupeKey: string; sendAt: Date }, m: EntityManager): Promise<{ id: string; send_at: Date } | null> =>
      (await q(m).query(
        `INSERT INTO reminders (programme_id, template, user_id, recipient_name, channel, to_address, time_zone, data, dedupe_key, send_at)
         VALUES ($1, 'delivery-failed', $2, $3, 'email', $4, $5, jsonb_build_object('failures', jsonb_build_array($6::jsonb)), $7, $8)
         ON CONFLICT (dedupe_key) DO UPDATE SET data = jsonb_set(reminders.data, '{failures}', (reminders.data -> 'failures') || (EXCLUDED.data -> 'failures')), updated_at = now()
           WHERE reminders.status = 'scheduled' AND NOT EXISTS (SELECT 1 FROM deliveries d WHERE d.reminder_id = reminders.id)
         RETURNING id, send_at`,
        [a.programmeId, a.userId, a.name, a.email, a.timeZone, JSON.stringify(a.item), a.dedupeKey, a.sendAt],
      ))[0] ?? null,

    /** Pending reminders of a visit become cancelled (the visit moved or was called off). */
    cancelForVisit: (visitId: string, m: EntityManager): Promise<unknown> =>
      q(m).query(`UPDATE reminders SET status = 'cancelled', reason = 'visit-changed', updated_at = now() WHERE visit_id = $1 AND status = 'scheduled'`, [visitId]),

    lockForDelivery: async (id: string, m: EntityManager): Promise<ReminderRow | null> =>
      (await q(m).query(`SELECT * FROM reminders WHERE id = $1 FOR UPDATE`, [id]))[0] ?? null,

    findById: async (id: string, m?: EntityManager): Promise<ReminderRow | null> => (await q(m).query(`SELECT * FROM reminders WHERE id = $1`, [id]))[0] ?? null,

    update: (id: string, set: Partial<Record<'status' | 'reason' | 'channel' | 'to_address' | 'send_at' | 'provider_id' | 'last_error' | 'sent_at' | 'attempts' | 'recipient_name' | 'language', unknown>>, m?: EntityManager): Promise<unknown> => {
      const keys = Object.keys(set);
      const params = [id, ...keys.map((k) => (set as Record<string, unknown>)[k])];
      return q(m).query(`UPDATE reminders SET ${keys.map((k, i) => `${k} = $${i + 2}`).join(', ')}, updated_at = now() WHERE id = $1`, params);
    },

    delivery: async (reminderId: string, m: EntityManager): Promise<DeliveryRow | null> =>
      (await q(m).query(`SELECT * FROM deliveries WHERE reminder_id = $1 FOR UPDATE`, [reminderId]))[0] ?? null,

    /** Records an attempt about to leave; the previous state (if any) tells the caller whether an earlier attempt may have gone out. */
    startAttempt: (reminderId: string, channel: Channel, toAddress: string, m: EntityManager): Promise<unknown> =>
      q(m).query(
        `INSERT INTO deliveries (reminder_id, state, channel, to_address, attempts, started_at) VALUES ($1, 'sending', $2, $3, 1, now())
         ON CONFLICT (reminder_id) DO UPDATE SET state = 'sending', channel = $2, to_address = $3, attempts = deliveries.attempts + 1,
           started_at = CASE WHEN deliveries.state = 'sending' THEN deliveries.started_at ELSE now() END`,
        [reminderId, channel, toAddress],
      ),

    finishAttempt: (reminderId: string, state: 'sent' | 'retrying' | 'failed', providerId: string | null, m?: EntityManager): Promise<unknown> =>
      q(m).query(`UPDATE deliveries SET state = $2, provider_id = COALESCE($3, provider_id), finished_at = now() WHERE reminder_id = $1`, [reminderId, state, providerId]),

    /** Scheduled reminders due within the look-ahead, oldest first: what the reconciler (re-)enqueues. */
    due: (lookAheadMs: number, limit: number): Promise<Array<{ id: string; send_at: Date }>> =>
      ds.query(`SELECT id, send_at FROM reminders WHERE status = 'scheduled' AND send_at <= now() + ($1 || ' milliseconds')::interval ORDER BY send_at LIMIT $2`, [String(lookAheadMs), limit]),

    /**
     * The message log: messages about babies the caller may read, plus the caller programme's staff messages, one
     * page in the sort's order from a position (list-paging.ts), and how many match. The baby's name comes from the
     * same join that checks the caller may read the baby (no query per row).
     * `qPhone`: the search text read as a phone number (E.164), when it is one, so '07700 900123' finds '+447700900123'.
     */
    async list(query: ListMessagesQuery, programmeId: string, infantAcl: SqlFilter | null, at: KeysetPosition, qPhone: string | null = null) {
      const { where, named } = logFilter(query, programmeId, infantAcl, qPhone);
      const from = `FROM reminders r LEFT JOIN infants i ON i.id = r.infant_id`;
      const page = keysetPageSql({
        select: `SELECT r.*, r.send_at::text AS k_send_at, i.given_name || ' ' || i.family_name AS infant_name ${from}`,
        where, params: named, key: MESSAGE_SORT_KEYS[query.sort], at, limit: query.pageSize + 1,
      });
      // Counted on the messages alone: each message's rights, when the caller has any to check, are a key lookup.
      // Not prepared: the page reads `r.*` (prepared.ts).
      const counted = logFilter(query, programmeId, infantAcl, qPhone, 'exists');
      const { rows, total, estimate } = await pageAndCount<MessageListRow>(ds, estimateRows, page, { sql: `SELECT 1 FROM reminders r WHERE ${counted.where.join(' AND ')}`, params: counted.named }, false);
      return { ...cutPage(rows, query.pageSize, at), total, estimate };
    },

    /** One page of the log after a row's keyset position, in the sort's order (mixed directions compared key by key). */
    async exportPage(query: Omit<ListMessagesQuery, 'page' | 'pageSize'>, programmeId: string, infantAcl: SqlFilter | null, qPhone: string | null, after: string[] | undefined, limit: number): Promise<MessageExportRow[]> {
      const { where, named } = logFilter(query, programmeId, infantAcl, qPhone);
      const keys = EXPORT_KEYS[query.sort];
      if (after) {
        keys.forEach((k, n) => { named[`after_${n}`] = after[n]; });
        const val = (n: number) => `CAST(:after_${n} AS ${keys[n]!.cast})`;
        // (k0 beyond) OR (k0 equal AND k1 beyond) OR …, "beyond" being > for an ascending key and < for a descending one.
        const terms = keys.map((k, n) => [...keys.slice(0, n).map((e, m) => `${e.col} = ${val(m)}`), `${k.col} ${k.dir === 'ASC' ? '>' : '<'} ${val(n)}`].join(' AND '));
        // The first key's inclusive bound, implied by the terms, lets PostgreSQL start its index scan at the position.
        where.push(`${keys[0]!.col} ${keys[0]!.dir === 'ASC' ? '>=' : '<='} ${val(0)}`, `((${terms.join(') OR (')}))`);
      }
      named.limit = limit;
      const [sql, params] = ds.driver.escapeQueryWithParameters(
        `SELECT r.*, i.given_name || ' ' || i.family_name AS infant_name, r.send_at::text AS k_send_at, r.status AS k_status, r.id::text AS k_id
           FROM reminders r LEFT JOIN infants i ON i.id = r.infant_id
          WHERE ${where.join(' AND ')} ORDER BY ${keys.map((k) => `${k.col} ${k.dir}`).join(', ')} LIMIT :limit`,
        named,
      );
      return ds.query(sql, params);
    },
  };
}
export type RemindersRepository = ReturnType<typeof createRemindersRepository>;
