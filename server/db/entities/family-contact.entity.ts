import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

@Entity({ name: 'family_contacts' })
export class FamilyContactEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  /** The family account that may sign in and see this baby, if one was made. */
  @Column({ type: 'uuid', name: 'user_id', nullable: true }) userId: string | null;
  @Column({ type: 'text' }) name: string;
  @Column({ type: 'text' }) relation: string;
  @Column({ type: 'text', nullable: true }) mobile: string | null;
  @Column({ type: 'text', nullable: true }) email: string | null;
  @Column({ type: 'text', name: 'preferred_channel' }) preferredChannel: 'sms' | 'email';
  @Column({ type: 'boolean', name: 'consent_sms' }) consentSms: boolean;
  @Column({ type: 'boolean', name: 'consent_email' }) consentEmail: boolean;
  @Column({ type: 'text' }) language: string;
  @Column({ type: 'text', name: 'time_zone' }) timeZone: string;
  @Column({ type: 'smallint' }) position: number;
  /** The family's own switch for visit reminders (opt-out). */
  @Column({ type: 'boolean', name: 'reminders_enabled', default: true }) remindersEnabled: boolean;
  @Column({ type: 'integer', name: 'row_version', default: 1 }) rowVersion: number;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
