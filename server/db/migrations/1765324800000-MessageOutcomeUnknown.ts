import type { MigrationInterface, QueryRunner } from 'typeorm';

// An e-mail attempt whose outcome cannot be settled with the provider waits for a coordinator as 'unknown'
// instead of being sent again blindly.
export class MessageOutcomeUnknown1765324800000 implements MigrationInterface {
  name = 'MessageOutcomeUnknown1765324800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE reminders DROP CONSTRAINT reminders_status_check`);
    await q.query(`ALTER TABLE reminders ADD CONSTRAINT reminders_status_check CHECK (status IN ('scheduled','sent','failed','skipped','cancelled','unknown'))`);
    await q.query(`CREATE INDEX reminders_unknown_idx ON reminders (programme_id) WHERE status = 'unknown'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX reminders_unknown_idx`);
    // Held messages go back to 'failed', the nearest older state, so the constraint can be restored.
    await q.query(`UPDATE reminders SET status = 'failed' WHERE status = 'unknown'`);
    await q.query(`ALTER TABLE reminders DROP CONSTRAINT reminders_status_check`);
    await q.query(`ALTER TABLE reminders ADD CONSTRAINT reminders_status_check CHECK (status IN ('scheduled','sent','failed','skipped','cancelled'))`);
  }
}
