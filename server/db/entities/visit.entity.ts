import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { VisitKind, VisitStatus } from '@shared/schemas/visits';

/** A booked home visit or clinic review; the local date and time are kept as the family was told them. */
@Entity({ name: 'visits' })
export class VisitEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'text' }) kind: VisitKind;
  @Column({ type: 'timestamptz', name: 'starts_at' }) startsAt: Date;
  @Column({ type: 'date', name: 'local_date' }) localDate: string;
  @Column({ type: 'text', name: 'local_time' }) localTime: string;
  @Column({ type: 'text', name: 'time_zone' }) timeZone: string;
  @Column({ type: 'smallint', name: 'duration_minutes' }) durationMinutes: number;
  @Column({ type: 'uuid', name: 'staff_id' }) staffId: string;
  @Column({ type: 'text' }) purpose: string;
  @Column({ type: 'text' }) status: VisitStatus;
  @Column({ type: 'text', name: 'cancel_reason', nullable: true }) cancelReason: string | null;
  @Column({ type: 'integer', name: 'row_version' }) rowVersion: number;
  @Column({ type: 'uuid', name: 'created_by' }) createdBy: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
