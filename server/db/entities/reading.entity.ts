import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { numeric } from './transformers';

@Entity({ name: 'readings' })
export class ReadingEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'uuid', name: 'check_id', nullable: true }) checkId: string | null;
  @Column({ type: 'timestamptz', name: 'taken_at' }) takenAt: Date;
  @Column({ type: 'smallint' }) spo2: number;
  @Column({ type: 'smallint', nullable: true }) pulse: number | null;
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'flow_lpm', nullable: true, transformer: numeric }) flowLpm: number | null;
  @Column({ type: 'text' }) state: 'awake' | 'asleep' | 'feeding' | 'crying';
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'weight_kg', nullable: true, transformer: numeric }) weightKg: number | null;
  @Column({ type: 'text', nullable: true }) notes: string | null;
  /** Raised by every correction; a correction must name the version it was made on (409 otherwise). */
  @Column({ type: 'integer', name: 'row_version', default: 1 }) rowVersion: number;
  @Column({ type: 'boolean', name: 'family_reported' }) familyReported: boolean;
  @Column({ type: 'uuid', name: 'created_by' }) createdBy: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
