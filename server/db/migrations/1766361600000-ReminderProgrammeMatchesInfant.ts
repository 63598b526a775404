import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A message about a baby belongs to that baby's programme, held by the database: the message log of someone who may
 * read every baby of their programme then needs no check of each message's baby (reminders.repository.ts), which
 * at 200,000 babies made PostgreSQL read the whole programme for every count.
 */
export class ReminderProgrammeMatchesInfant1766361600000 implements MigrationInterface {
  name = 'ReminderProgrammeMatchesInfant1766361600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE infants ADD CONSTRAINT infants_id_programme_key UNIQUE (id, programme_id)`);
    await q.query(`ALTER TABLE reminders ADD CONSTRAINT reminders_infant_programme_fkey
      FOREIGN KEY (infant_id, programme_id) REFERENCES infants (id, programme_id) ON DELETE CASCADE`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE reminders DROP CONSTRAINT reminders_infant_programme_fkey`);
    await q.query(`ALTER TABLE infants DROP CONSTRAINT infants_id_programme_key`);
  }
}
