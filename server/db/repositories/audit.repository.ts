import type { DataSource, EntityManager } from 'typeorm';
import { AuditEventEntity } from '../entities/audit-event.entity';

export interface AuditEntry {
  programmeId: string | null;
  actorId: string | null;
  action: string;
  entityType: string;
  entityId?: string | null;
  details?: Record<string, unknown>;
  ip?: string | null;
}

export interface ReadEntry {
  programmeId: string;
  actorId: string;
  action: string;
  /** The baby whose record was read; null for a list read (the caseload or the message log as CSV). */
  infantId: string | null;
  entityType: 'infant' | 'caseload' | 'messages';
  details?: Record<string, unknown>;
  ip: string | null;
}

export interface ReadRow {
  id: string;
  at: Date;
  /** `at` to the microsecond, for the page cursor (a Date keeps milliseconds only). */
  atExact: string;
  action: string;
  actorId: string | null;
  actorName: string | null;
  actorRole: string | null;
  ip: string | null;
  details: Record<string, unknown>;
}

export interface ReadFilter {
  actorId?: string;
  from?: Date;
  to?: Date;
  /** Keyset: rows strictly older than this (at, id). */
  before?: { at: string; id: string };
  limit: number;
}

export function createAuditRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(AuditEventEntity);
  return {
    append: (entry: AuditEntry, m?: EntityManager) =>
      repo(m).save(
        repo(m).create({
        programmeId: entry.programmeId,
        actorId: entry.actorId,
        action: entry.action,
        entityType: entry.entityType,
        entityId: entry.entityId ?? null,
        details: entry.details ?? {},
        ip: entry.ip ?? null,
        }),
      ),
    /** One statement in its own transaction: the chain head is locked only for as long as this insert takes. */
    appendRead: async (entry: ReadEntry): Promise<void> => {
      await ds.query(
        `INSERT INTO audit_events (programme_id, actor_id, kind, action, entity_type, entity_id, details, ip)
         VALUES ($1, $2, 'read', $3, $4, $5, $6, $7)`,
        [entry.programmeId, entry.actorId, entry.action, entry.entityType, entry.infantId, JSON.stringify(entry.details ?? {}), entry.ip],
      );
    },
    /** The change trail of one record; reads are listed separately (listReads). */
    listForEntity: (entityType: string, entityId: string) =>
      repo().find({ where: { entityType, entityId, kind: 'write' }, order: { at: 'DESC', id: 'DESC' }, take: 200 }),
    /** Who opened one baby's record, newest first, a page at a time (index audit_events_reads_idx). */
    async listReads(programmeId: string, infantId: string, f: ReadFilter): Promise<ReadRow[]> {
      const where = [`e.kind = 'read'`, `e.entity_id = $1`, `e.programme_id = $2`, `e.entity_type = 'infant'`];
      const params: unknown[] = [infantId, programmeId];
      const add = (sql: string, ...values: unknown[]) => {
        where.push(sql.replace(/\?/g, () => `$${params.push(values.shift())}`));
      };
      if (f.actorId) add('e.actor_id = ?', f.actorId);
      if (f.from) add('e.at >= ?', f.from);
      if (f.to) add('e.at < ?', f.to);
      if (f.before) add('(e.at, e.id) < (?::timestamptz, ?::bigint)', f.before.at, f.before.id);
      const rows: Array<Record<string, unknown>> = await ds.query(
        `SELECT e.id::text AS id, e.at, to_char(e.at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"') AS at_exact,
                e.action, e.actor_id, u.name AS actor_name, u.role AS actor_role, e.ip, e.details
         FROM audit_events e LEFT JOIN users u ON u.id = e.actor_id
         WHERE ${where.join(' AND ')} ORDER BY e.at DESC, e.id DESC LIMIT ${Math.trunc(f.limit)}`,
        params,
      );
      return rows.map((r) => ({
        id: r.id as string, at: r.at as Date, action: r.action as string, actorId: r.actor_id as string | null,
        actorName: r.actor_name as string | null, actorRole: r.actor_role as string | null, ip: r.ip as string | null,
        details: r.details as Record<string, unknown>, atExact: r.at_exact as string,
      }));
    },
  };
}
export type AuditRepository = ReturnType<typeof createAuditRepository>;
