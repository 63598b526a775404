import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Journeys1765152000000 implements MigrationInterface {
  name = 'Journeys1765152000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE journeys (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      prescription_id uuid NOT NULL REFERENCES prescriptions(id),
      policy_version integer NOT NULL,
      status text NOT NULL DEFAULT 'waiting' CHECK (status IN ('waiting','approved','declined')),
      row_version integer NOT NULL DEFAULT 1,
      mode text NOT NULL CHECK (mode IN ('road','flight')),
      destination_name text NOT NULL,
      destination_elevation_m double precision,
      cabin_altitude_ft double precision CHECK (cabin_altitude_ft IS NULL OR cabin_altitude_ft BETWEEN 0 AND 8000),
      depart_on date NOT NULL,
      return_on date NOT NULL,
      hours_away double precision NOT NULL CHECK (hours_away > 0 AND hours_away <= 1440),
      notes text,
      plan jsonb NOT NULL,
      requested_by uuid NOT NULL REFERENCES users(id),
      decided_by uuid REFERENCES users(id),
      decided_at timestamptz,
      decision_reason text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK (return_on >= depart_on),
      CHECK (mode = 'flight' OR destination_elevation_m IS NOT NULL),
      CHECK ((status = 'waiting') = (decided_at IS NULL))
    )`);
    await q.query(`CREATE INDEX journeys_infant_idx ON journeys (infant_id, created_at DESC)`);
    await q.query(`CREATE INDEX journeys_waiting_idx ON journeys (programme_id, created_at) WHERE status = 'waiting'`);
    await q.query(`CREATE INDEX journeys_departing_idx ON journeys (depart_on) WHERE status = 'approved'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE journeys`);
  }
}
