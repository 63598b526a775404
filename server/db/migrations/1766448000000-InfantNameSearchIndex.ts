import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The caseload's name search ("contains", infants.repository.ts) from a trigram index on the full name: without it a
 * search for a name not in the programme read every baby (about 0.3–0.6 s at 200,000). pg_trgm ships with
 * PostgreSQL's contrib modules and is a trusted extension, so the database's owner may create it.
 */
export class InfantNameSearchIndex1766448000000 implements MigrationInterface {
  name = 'InfantNameSearchIndex1766448000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pg_trgm`);
    // The expression must stay the one the search uses, ((given_name || ' ') || family_name), for the index to serve it.
    // fastupdate off: babies are enrolled a few at a time, and each goes straight into the index rather than into a
    // pending list, which is read on every search until a vacuum and made the planner pass the index by.
    await q.query(`CREATE INDEX infants_full_name_trgm_idx ON infants USING gin ((given_name || ' ' || family_name) gin_trgm_ops) WITH (fastupdate = off)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX infants_full_name_trgm_idx`);
  }
}
