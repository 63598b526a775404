import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { JourneyMode, JourneyPlan, JourneyStatus } from '@shared/schemas/journeys';

/**
 * A journey check: the request as the family or coordinator made it, and the plan computed from the approved
 * setting it names. The plan is a proposal until the consultant decides.
 */
@Entity({ name: 'journeys' })
export class JourneyEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  /** The approved setting the plan was computed from; a newer one makes the plan stale. */
  @Column({ type: 'uuid', name: 'prescription_id' }) prescriptionId: string;
  @Column({ type: 'integer', name: 'policy_version' }) policyVersion: number;
  @Column({ type: 'text' }) status: JourneyStatus;
  @Column({ type: 'integer', name: 'row_version' }) rowVersion: number;
  @Column({ type: 'text' }) mode: JourneyMode;
  @Column({ type: 'text', name: 'destination_name' }) destinationName: string;
  @Column({ type: 'double precision', name: 'destination_elevation_m', nullable: true }) destinationElevationM: number | null;
  @Column({ type: 'double precision', name: 'cabin_altitude_ft', nullable: true }) cabinAltitudeFt: number | null;
  @Column({ type: 'date', name: 'depart_on' }) departOn: string;
  @Column({ type: 'date', name: 'return_on' }) returnOn: string;
  @Column({ type: 'double precision', name: 'hours_away' }) hoursAway: number;
  @Column({ type: 'text', nullable: true }) notes: string | null;
  @Column({ type: 'jsonb' }) plan: JourneyPlan;
  @Column({ type: 'uuid', name: 'requested_by' }) requestedBy: string;
  @Column({ type: 'uuid', name: 'decided_by', nullable: true }) decidedBy: string | null;
  @Column({ type: 'timestamptz', name: 'decided_at', nullable: true }) decidedAt: Date | null;
  @Column({ type: 'text', name: 'decision_reason', nullable: true }) decisionReason: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
