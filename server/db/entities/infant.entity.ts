import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { PressureSource } from '@shared/clinical/pressure';
import type { InfantFlag, InfantStatus } from '@shared/schemas/infants';
import { numeric } from './transformers';

@Entity({ name: 'infants' })
export class InfantEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'enrol_key' }) enrolKey: string;
  @Column({ type: 'text', name: 'given_name' }) givenName: string;
  @Column({ type: 'text', name: 'family_name' }) familyName: string;
  @Column({ type: 'text' }) sex: 'female' | 'male' | 'unknown';
  @Column({ type: 'date', name: 'birth_date' }) birthDate: string;
  @Column({ type: 'smallint', name: 'ga_weeks' }) gaWeeks: number;
  @Column({ type: 'smallint', name: 'ga_days' }) gaDays: number;
  /** Birth date plus the days short of 40 weeks: corrected age is measured from here (AAP 2004). */
  @Column({ type: 'date', name: 'term_date' }) termDate: string;
  @Column({ type: 'integer', name: 'birth_weight_g' }) birthWeightG: number;
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'weight_kg', transformer: numeric }) weightKg: number;
  @Column({ type: 'date', name: 'weight_date' }) weightDate: string;
  @Column({ type: 'text', array: true }) diagnoses: string[];
  @Column({ type: 'uuid', name: 'site_id' }) siteId: string;
  @Column({ type: 'numeric', precision: 6, scale: 3, name: 'hospital_flow_lpm', transformer: numeric }) hospitalFlowLpm: number;
  @Column({ type: 'numeric', precision: 5, scale: 2, name: 'hospital_o2_percent', transformer: numeric }) hospitalO2Percent: number;
  @Column({ type: 'text', name: 'hospital_source' }) hospitalSource: 'cylinder' | 'concentrator' | 'blended';
  @Column({ type: 'text', name: 'home_source' }) homeSource: 'cylinder' | 'concentrator';
  @Column({ type: 'numeric', precision: 5, scale: 2, name: 'home_o2_percent', transformer: numeric }) homeO2Percent: number;
  @Column({ type: 'text', name: 'home_address' }) homeAddress: string;
  @Column({ type: 'jsonb', name: 'home_location' }) homeLocation: PressureSource;
  @Column({ type: 'numeric', precision: 7, scale: 1, name: 'home_elevation_m', nullable: true, transformer: numeric }) homeElevationM: number | null;
  @Column({ type: 'numeric', precision: 6, scale: 2, name: 'home_pressure_mmhg', transformer: numeric }) homePressureMmHg: number;
  @Column({ type: 'uuid', name: 'nurse_id', nullable: true }) nurseId: string | null;
  @Column({ type: 'uuid', name: 'consultant_id', nullable: true }) consultantId: string | null;
  @Column({ type: 'text' }) status: InfantStatus;
  @Column({ type: 'text', array: true }) flags: InfantFlag[];
  @Column({ type: 'integer', name: 'row_version' }) rowVersion: number;
  @Column({ type: 'timestamptz', name: 'off_oxygen_since', nullable: true }) offOxygenSince: Date | null;
  @Column({ type: 'uuid', name: 'created_by', nullable: true }) createdBy: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
