import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Monitoring1764892800000 implements MigrationInterface {
  name = 'Monitoring1764892800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE infants ADD COLUMN off_oxygen_since timestamptz`);
    await q.query(`ALTER TABLE prescriptions ADD COLUMN evidence jsonb`);
    await q.query(`CREATE TABLE checks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      plan_key text NOT NULL,
      kind text NOT NULL CHECK (kind IN ('spot_check','overnight_study','room_air_challenge','step_down_review')),
      due_at timestamptz NOT NULL,
      due_date date NOT NULL,
      status text NOT NULL DEFAULT 'planned' CHECK (status IN ('planned','overdue','done','cancelled')),
      done_at timestamptz,
      done_by uuid REFERENCES users(id),
      done_ref text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (infant_id, plan_key)
    )`);
    await q.query(`CREATE INDEX checks_due_idx ON checks (programme_id, status, due_at)`);
    await q.query(`CREATE INDEX checks_infant_idx ON checks (infant_id, due_at)`);
    await q.query(`CREATE TABLE readings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      check_id uuid REFERENCES checks(id),
      taken_at timestamptz NOT NULL,
      spo2 smallint NOT NULL CHECK (spo2 BETWEEN 50 AND 100),
      pulse smallint CHECK (pulse BETWEEN 40 AND 250),
      flow_lpm numeric(6,3) CHECK (flow_lpm >= 0 AND flow_lpm <= 15),
      state text NOT NULL CHECK (state IN ('awake','asleep','feeding','crying')),
      weight_kg numeric(6,3) CHECK (weight_kg > 0 AND weight_kg <= 15),
      notes text,
      family_reported boolean NOT NULL DEFAULT false,
      created_by uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX readings_infant_taken_idx ON readings (infant_id, taken_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE readings`);
    await q.query(`DROP TABLE checks`);
    await q.query(`ALTER TABLE prescriptions DROP COLUMN evidence`);
    await q.query(`ALTER TABLE infants DROP COLUMN off_oxygen_since`);
  }
}
