import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Enrolment1764720000000 implements MigrationInterface {
  name = 'Enrolment1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE sites (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      name text NOT NULL,
      elevation_m numeric(7,1) NOT NULL CHECK (elevation_m BETWEEN -500 AND 6000),
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (programme_id, name)
    )`);
    await q.query(`CREATE TABLE programme_policies (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      version integer NOT NULL CHECK (version > 0),
      settings jsonb NOT NULL,
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (programme_id, version)
    )`);
    await q.query(`CREATE TABLE infants (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      enrol_key uuid NOT NULL,
      given_name text NOT NULL,
      family_name text NOT NULL,
      sex text NOT NULL CHECK (sex IN ('female','male','unknown')),
      birth_date date NOT NULL,
      ga_weeks smallint NOT NULL CHECK (ga_weeks BETWEEN 22 AND 44),
      ga_days smallint NOT NULL CHECK (ga_days BETWEEN 0 AND 6),
      term_date date NOT NULL,
      birth_weight_g integer NOT NULL CHECK (birth_weight_g BETWEEN 300 AND 6500),
      weight_kg numeric(6,3) NOT NULL CHECK (weight_kg > 0 AND weight_kg <= 15),
      weight_date date NOT NULL,
      diagnoses text[] NOT NULL DEFAULT '{}',
      site_id uuid NOT NULL REFERENCES sites(id),
      hospital_flow_lpm numeric(6,3) NOT NULL CHECK (hospital_flow_lpm >= 0 AND hospital_flow_lpm <= 15),
      hospital_o2_percent numeric(5,2) NOT NULL CHECK (hospital_o2_percent BETWEEN 21 AND 100),
      hospital_source text NOT NULL CHECK (hospital_source IN ('cylinder','concentrator','blended')),
      home_source text NOT NULL CHECK (home_source IN ('cylinder','concentrator')),
      home_o2_percent numeric(5,2) NOT NULL CHECK (home_o2_percent BETWEEN 21 AND 100),
      home_address text NOT NULL,
      home_location jsonb NOT NULL,
      home_elevation_m numeric(7,1),
      home_pressure_mmhg numeric(6,2) NOT NULL,
      nurse_id uuid REFERENCES users(id),
      consultant_id uuid REFERENCES users(id),
      status text NOT NULL DEFAULT 'preparing',
      flags text[] NOT NULL DEFAULT '{}',
      row_version integer NOT NULL DEFAULT 1,
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (programme_id, enrol_key)
    )`);
    await q.query(`CREATE INDEX infants_programme_status_idx ON infants (programme_id, status)`);
    await q.query(`CREATE INDEX infants_programme_nurse_idx ON infants (programme_id, nurse_id)`);
    await q.query(`CREATE INDEX infants_programme_name_idx ON infants (programme_id, family_name, given_name)`);
    await q.query(`CREATE INDEX infants_programme_term_idx ON infants (programme_id, term_date)`);
    await q.query(`CREATE INDEX infants_programme_elevation_idx ON infants (programme_id, home_pressure_mmhg)`);
    await q.query(`CREATE TABLE family_contacts (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      programme_id uuid NOT NULL REFERENCES programmes(id),
      user_id uuid REFERENCES users(id),
      name text NOT NULL,
      relation text NOT NULL,
      mobile text,
      email text,
      preferred_channel text NOT NULL CHECK (preferred_channel IN ('sms','email')),
      consent_sms boolean NOT NULL DEFAULT false,
      consent_email boolean NOT NULL DEFAULT false,
      language text NOT NULL DEFAULT 'en',
      time_zone text NOT NULL,
      position smallint NOT NULL DEFAULT 0,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX family_contacts_infant_idx ON family_contacts (infant_id)`);
    await q.query(`CREATE INDEX family_contacts_user_idx ON family_contacts (user_id) WHERE user_id IS NOT NULL`);
    await q.query(`CREATE TABLE prescriptions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      programme_id uuid NOT NULL REFERENCES programmes(id),
      version integer NOT NULL,
      status text NOT NULL CHECK (status IN ('preparing','proposed','active','superseded','rejected','withdrawn')),
      reason text NOT NULL,
      input jsonb NOT NULL,
      result jsonb,
      model jsonb,
      computed_at timestamptz,
      required_flow_lpm numeric(10,6),
      proposed_flow_lpm numeric(6,3),
      approved_flow_lpm numeric(6,3),
      approved_fio2 numeric(6,4),
      approved_weight_kg numeric(6,3),
      source text NOT NULL,
      source_o2_percent numeric(5,2) NOT NULL,
      periods jsonb,
      decided_by uuid REFERENCES users(id),
      decided_at timestamptz,
      decision_reason text,
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (infant_id, version)
    )`);
    await q.query(`CREATE INDEX prescriptions_queue_idx ON prescriptions (programme_id, status, created_at)`);
    // At most one active plan per baby, enforced by the database.
    await q.query(`CREATE UNIQUE INDEX prescriptions_one_active_idx ON prescriptions (infant_id) WHERE status = 'active'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE prescriptions`);
    await q.query(`DROP TABLE family_contacts`);
    await q.query(`DROP TABLE infants`);
    await q.query(`DROP TABLE programme_policies`);
    await q.query(`DROP TABLE sites`);
  }
}
