import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { PrescriptionConversion } from '@shared/clinical/conversion-types';
import type { PrescriptionReason, PrescriptionStatus } from '@shared/schemas/prescriptions';
import { numeric } from './transformers';

/** One version of a baby's home setting: computed by the worker, a proposal until a consultant decides. */
@Entity({ name: 'prescriptions' })
export class PrescriptionEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'integer' }) version: number;
  @Column({ type: 'text' }) status: PrescriptionStatus;
  @Column({ type: 'text' }) reason: PrescriptionReason;
  @Column({ type: 'jsonb' }) input: Record<string, unknown>;
  @Column({ type: 'jsonb', nullable: true }) result: PrescriptionConversion | null;
  @Column({ type: 'jsonb', nullable: true }) model: Record<string, unknown> | null;
  @Column({ type: 'timestamptz', name: 'computed_at', nullable: true }) computedAt: Date | null;
  @Column({ type: 'numeric', precision: 10, scale: 6, name: 'required_flow_lpm', nullable: true, transformer: numeric }) requiredFlowLpm: number | null;
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'proposed_flow_lpm', nullable: true, transformer: numeric }) proposedFlowLpm: number | null;
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'approved_flow_lpm', nullable: true, transformer: numeric }) approvedFlowLpm: number | null;
  @Column({ type: 'numeric', precision: 6, scale: 4, name: 'approved_fio2', nullable: true, transformer: numeric }) approvedFio2: number | null;
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'approved_weight_kg', nullable: true, transformer: numeric }) approvedWeightKg: number | null;
  @Column({ type: 'text' }) source: string;
  @Column({ type: 'numeric', precision: 5, scale: 2, name: 'source_o2_percent', transformer: numeric }) sourceO2Percent: number;
  /** For step changes: the study and targets that justified the proposal. */
  @Column({ type: 'jsonb', nullable: true }) evidence: Record<string, unknown> | null;
  @Column({ type: 'jsonb', nullable: true }) periods: { awake: number; asleep: number; feeding: number } | null;
  @Column({ type: 'uuid', name: 'decided_by', nullable: true }) decidedBy: string | null;
  @Column({ type: 'timestamptz', name: 'decided_at', nullable: true }) decidedAt: Date | null;
  @Column({ type: 'text', name: 'decision_reason', nullable: true }) decisionReason: string | null;
  @Column({ type: 'uuid', name: 'created_by', nullable: true }) createdBy: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
