import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { CheckKind, CheckStatus } from '@shared/schemas/schedule';

/** A planned oximetry check or review; plan_key makes re-planning an upsert, never a duplicate. */
@Entity({ name: 'checks' })
export class CheckEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'text', name: 'plan_key' }) planKey: string;
  @Column({ type: 'text' }) kind: CheckKind;
  @Column({ type: 'timestamptz', name: 'due_at' }) dueAt: Date;
  @Column({ type: 'date', name: 'due_date' }) dueDate: string;
  @Column({ type: 'text' }) status: CheckStatus;
  @Column({ type: 'timestamptz', name: 'done_at', nullable: true }) doneAt: Date | null;
  @Column({ type: 'uuid', name: 'done_by', nullable: true }) doneBy: string | null;
  @Column({ type: 'text', name: 'done_ref', nullable: true }) doneRef: string | null;
  /** Shown with the check, e.g. that a repeat is needed because the last study was too short to judge. */
  @Column({ type: 'text', nullable: true }) note: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
