import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The message log's search ("contains", reminders.repository.ts) from indexes: trigram indexes on the recipient's
 * name and address, beside the baby's name (infants_full_name_trgm_idx) and the messages-by-baby index. Without them
 * a search for a name no message has read every message of the programme (about 0.3 s at 50,000). Messages are
 * written in bursts, so these keep GIN's pending list (fastupdate); autovacuum folds it in.
 */
export class MessageSearchIndexes1766534400000 implements MigrationInterface {
  name = 'MessageSearchIndexes1766534400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pg_trgm`);
    await q.query(`CREATE INDEX reminders_recipient_trgm_idx ON reminders USING gin (recipient_name gin_trgm_ops)`);
    await q.query(`CREATE INDEX reminders_address_trgm_idx ON reminders USING gin (to_address gin_trgm_ops)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX reminders_address_trgm_idx`);
    await q.query(`DROP INDEX reminders_recipient_trgm_idx`);
  }
}
