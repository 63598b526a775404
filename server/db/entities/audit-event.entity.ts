import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * Append-only: a database trigger refuses UPDATE and DELETE on this table. Another fills the chain columns on insert
 * (migration 1766102400000), so the application never sets them.
 */
@Entity({ name: 'audit_events' })
@Index('audit_events_programme_at_idx', ['programmeId', 'at'])
@Index('audit_events_entity_idx', ['entityType', 'entityId'])
export class AuditEventEntity {
  @PrimaryGeneratedColumn('increment', { type: 'bigint' })
  id: string;

  @Column({ type: 'uuid', name: 'programme_id', nullable: true })
  programmeId: string | null;

  @Column({ type: 'uuid', name: 'actor_id', nullable: true })
  actorId: string | null;

  /** 'write' (a change) or 'read' (someone opened a baby's record). */
  @Column({ type: 'text', default: 'write' })
  kind: 'write' | 'read';

  @Column({ type: 'text' })
  action: string;

  @Column({ type: 'text', name: 'entity_type' })
  entityType: string;

  @Column({ type: 'text', name: 'entity_id', nullable: true })
  entityId: string | null;

  @Column({ type: 'jsonb', default: () => "'{}'::jsonb" })
  details: Record<string, unknown>;

  @Column({ type: 'text', nullable: true })
  ip: string | null;

  @CreateDateColumn({ type: 'timestamptz' })
  at: Date;

  @Column({ type: 'bigint', name: 'chain_seq', insert: false, update: false })
  chainSeq: string;

  @Column({ type: 'text', name: 'prev_hash', insert: false, update: false })
  prevHash: string;

  @Column({ type: 'text', name: 'row_hash', insert: false, update: false })
  rowHash: string;
}
