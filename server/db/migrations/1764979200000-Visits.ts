import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Visits1764979200000 implements MigrationInterface {
  name = 'Visits1764979200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE visits (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('home_visit','clinic_review')),
      starts_at timestamptz NOT NULL,
      local_date date NOT NULL,
      local_time text NOT NULL,
      time_zone text NOT NULL,
      duration_minutes smallint NOT NULL CHECK (duration_minutes BETWEEN 5 AND 480),
      staff_id uuid NOT NULL REFERENCES users(id),
      purpose text NOT NULL,
      status text NOT NULL DEFAULT 'booked' CHECK (status IN ('booked','cancelled','done')),
      cancel_reason text,
      row_version integer NOT NULL DEFAULT 1,
      created_by uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX visits_infant_idx ON visits (infant_id, starts_at)`);
    await q.query(`CREATE INDEX visits_staff_day_idx ON visits (programme_id, staff_id, local_date) WHERE status = 'booked'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE visits`);
  }
}
