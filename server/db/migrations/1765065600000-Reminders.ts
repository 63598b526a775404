import type { MigrationInterface, QueryRunner } from 'typeorm';

// Reminders are rows written with the change that causes them; the deliveries ledger holds one row per reminder
// (its primary key is the reminder id), so a repeated attempt can tell what happened before it.
export class Reminders1765065600000 implements MigrationInterface {
  name = 'Reminders1765065600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE family_contacts
      ADD COLUMN reminders_enabled boolean NOT NULL DEFAULT true,
      ADD COLUMN row_version integer NOT NULL DEFAULT 1`);
    await q.query(`CREATE INDEX family_contacts_mobile_idx ON family_contacts ((regexp_replace(mobile, '[^0-9+]', '', 'g'))) WHERE mobile IS NOT NULL`);
    await q.query(`CREATE TABLE reminders (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid REFERENCES infants(id) ON DELETE CASCADE,
      visit_id uuid REFERENCES visits(id) ON DELETE CASCADE,
      template text NOT NULL,
      contact_id uuid REFERENCES family_contacts(id) ON DELETE SET NULL,
      user_id uuid REFERENCES users(id),
      recipient_name text NOT NULL,
      channel text CHECK (channel IN ('sms','email')),
      to_address text,
      language text NOT NULL DEFAULT 'en',
      time_zone text NOT NULL,
      data jsonb NOT NULL DEFAULT '{}'::jsonb,
      dedupe_key text NOT NULL UNIQUE,
      send_at timestamptz NOT NULL,
      not_after timestamptz,
      status text NOT NULL DEFAULT 'scheduled' CHECK (status IN ('scheduled','sent','failed','skipped','cancelled')),
      reason text,
      attempts integer NOT NULL DEFAULT 0,
      provider_id text,
      last_error text,
      sent_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX reminders_due_idx ON reminders (send_at) WHERE status = 'scheduled'`);
    await q.query(`CREATE INDEX reminders_log_idx ON reminders (programme_id, send_at DESC)`);
    await q.query(`CREATE INDEX reminders_visit_idx ON reminders (visit_id) WHERE visit_id IS NOT NULL`);
    await q.query(`CREATE INDEX reminders_infant_idx ON reminders (infant_id) WHERE infant_id IS NOT NULL`);
    await q.query(`CREATE TABLE deliveries (
      reminder_id uuid PRIMARY KEY REFERENCES reminders(id) ON DELETE CASCADE,
      state text NOT NULL CHECK (state IN ('sending','retrying','sent','failed')),
      channel text NOT NULL CHECK (channel IN ('sms','email')),
      to_address text NOT NULL,
      attempts integer NOT NULL DEFAULT 1,
      started_at timestamptz NOT NULL,
      provider_id text,
      finished_at timestamptz
    )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE deliveries`);
    await q.query(`DROP TABLE reminders`);
    await q.query(`DROP INDEX family_contacts_mobile_idx`);
    await q.query(`ALTER TABLE family_contacts DROP COLUMN reminders_enabled, DROP COLUMN row_version`);
  }
}
