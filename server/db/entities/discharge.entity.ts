import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/** One checklist item of one baby; the item's wording and rules are the programme's policy. */
@Entity({ name: 'discharge_items' })
export class DischargeItemEntity {
  @PrimaryColumn({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @PrimaryColumn({ type: 'text' }) key: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'boolean' }) done: boolean;
  @Column({ type: 'uuid', name: 'done_by', nullable: true }) doneBy: string | null;
  @Column({ type: 'timestamptz', name: 'done_at', nullable: true }) doneAt: Date | null;
  @Column({ type: 'text' }) note: string;
  @Column({ type: 'jsonb', nullable: true }) evidence: { date?: string; person?: string } | null;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}

/** The discharge step of one baby: the date, who set it, an override's reason and the proposed first visit. */
@Entity({ name: 'discharges' })
export class DischargeEntity {
  @PrimaryColumn({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'date', name: 'discharged_on', nullable: true }) dischargedOn: string | null;
  @Column({ type: 'uuid', name: 'set_by', nullable: true }) setBy: string | null;
  @Column({ type: 'timestamptz', name: 'set_at', nullable: true }) setAt: Date | null;
  @Column({ type: 'text', name: 'override_reason', nullable: true }) overrideReason: string | null;
  @Column({ type: 'text', array: true, name: 'override_missing' }) overrideMissing: string[];
  @Column({ type: 'date', name: 'first_visit_on', nullable: true }) firstVisitOn: string | null;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
