import type { MigrationInterface, QueryRunner } from 'typeorm';

// The coordinator's start page counts a programme's failed messages on every load; without this it would read the
// programme's whole message log (the 'unknown' ones already have their own index).
export class OverviewIndexes1765670400000 implements MigrationInterface {
  name = 'OverviewIndexes1765670400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX reminders_failed_idx ON reminders (programme_id) WHERE status = 'failed'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX reminders_failed_idx`);
  }
}
