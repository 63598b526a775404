import type { MigrationInterface, QueryRunner } from 'typeorm';

// One row per ticked-or-unticked checklist item of a baby (the items themselves are the programme's policy), and
// one row per baby for the discharge step: the date, an override's reason and the proposed first home visit.
export class DischargeChecklist1766188800000 implements MigrationInterface {
  name = 'DischargeChecklist1766188800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE discharge_items (
        infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
        programme_id uuid NOT NULL REFERENCES programmes(id),
        key text NOT NULL,
        done boolean NOT NULL DEFAULT false,
        done_by uuid REFERENCES users(id),
        done_at timestamptz,
        note text NOT NULL DEFAULT '',
        evidence jsonb,
        updated_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (infant_id, key)
      )`);
    await q.query(`
      CREATE TABLE discharges (
        infant_id uuid PRIMARY KEY REFERENCES infants(id) ON DELETE CASCADE,
        programme_id uuid NOT NULL REFERENCES programmes(id),
        discharged_on date,
        set_by uuid REFERENCES users(id),
        set_at timestamptz,
        override_reason text,
        override_missing text[] NOT NULL DEFAULT '{}',
        first_visit_on date,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    // The coordinator's overview: babies of a programme with a date, or with work under way.
    await q.query('CREATE INDEX discharges_programme_date_idx ON discharges (programme_id, discharged_on)');
    await q.query('CREATE INDEX discharge_items_programme_idx ON discharge_items (programme_id, infant_id)');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE IF EXISTS discharges');
    await q.query('DROP TABLE IF EXISTS discharge_items');
  }
}
