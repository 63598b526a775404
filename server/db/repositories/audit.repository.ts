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
    listForEntity: (entityType: string, entityId: string) =>
      repo().find({ where: { entityType, entityId }, order: { at: 'DESC', id: 'DESC' }, take: 200 }),
  };
}
export type AuditRepository = ReturnType<typeof createAuditRepository>;
