import type { MigrationInterface, QueryRunner } from 'typeorm';

// The caseload reads one page by walking an index in the page's order from the cursor, so a page costs the same
// at 200,000 babies as at 200. Each sort has an index, alone and after a status filter, ending in the id that
// breaks ties (server/db/repositories/infants.repository.ts, sortKey).
const INDEXES: Array<[string, string]> = [
  ['infants_p_name_idx', '(programme_id, family_name, given_name, id)'],
  ['infants_p_status_name_idx', '(programme_id, status, family_name, given_name, id)'],
  ['infants_p_term_idx', '(programme_id, term_date, id)'],
  ['infants_p_status_term_idx', '(programme_id, status, term_date, id)'],
  ['infants_p_pressure_idx', '(programme_id, home_pressure_mmhg, id)'],
  ['infants_p_status_pressure_idx', '(programme_id, status, home_pressure_mmhg, id)'],
  ['infants_p_created_idx', '(programme_id, created_at, id)'],
  ['infants_p_status_created_idx', '(programme_id, status, created_at, id)'],
  ['infants_p_status_id_idx', '(programme_id, status, id)'],
  ['infants_nurse_name_idx', '(nurse_id, family_name, given_name, id)'],
];
// Superseded by the wider ones above.
const OLD: Array<[string, string]> = [
  ['infants_programme_name_idx', '(programme_id, family_name, given_name)'],
  ['infants_programme_term_idx', '(programme_id, term_date)'],
  ['infants_programme_elevation_idx', '(programme_id, home_pressure_mmhg)'],
  ['infants_programme_status_idx', '(programme_id, status)'],
];

export class ListIndexes1765929600000 implements MigrationInterface {
  name = 'ListIndexes1765929600000';

  async up(q: QueryRunner): Promise<void> {
    for (const [name, cols] of INDEXES) await q.query(`CREATE INDEX IF NOT EXISTS ${name} ON infants ${cols}`);
    for (const [name] of OLD) await q.query(`DROP INDEX IF EXISTS ${name}`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const [name, cols] of OLD) await q.query(`CREATE INDEX IF NOT EXISTS ${name} ON infants ${cols}`);
    for (const [name] of INDEXES) await q.query(`DROP INDEX IF EXISTS ${name}`);
  }
}
