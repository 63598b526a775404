import type { MigrationInterface, QueryRunner } from 'typeorm';

// The message log and People read one page by walking an index in the page's order from the cursor
// (server/db/repositories/list-paging.ts), so a page costs the same with 200,000 messages as with 200. Each sort has
// an index, alone and after each filter, ending in the id that breaks ties (MESSAGE_SORT_KEYS, USER_SORT_KEYS).
const INDEXES: Array<[string, string]> = [
  // Message log: by time, and after a status, channel, message type or baby filter.
  ['reminders_p_send_idx', 'reminders (programme_id, send_at, id)'],
  ['reminders_p_status_send_idx', 'reminders (programme_id, status, send_at, id)'],
  ['reminders_p_channel_send_idx', 'reminders (programme_id, channel, send_at, id)'],
  ['reminders_p_template_send_idx', 'reminders (programme_id, template, send_at, id)'],
  ['reminders_infant_send_idx', 'reminders (infant_id, send_at, id) WHERE infant_id IS NOT NULL'],
  // By status A→Z, newest first within a status (the reverse order reads reminders_p_status_send_idx backwards).
  ['reminders_p_status_newest_idx', 'reminders (programme_id, status, send_at DESC, id DESC)'],
  // People: by name, e-mail or date added, alone and after a role filter; by role, then name.
  ['users_p_name_idx', 'users (programme_id, name, id)'],
  ['users_p_email_idx', 'users (programme_id, email, id)'],
  ['users_p_created_idx', 'users (programme_id, created_at, id)'],
  ['users_p_role_name_idx', 'users (programme_id, role, name, id)'],
  ['users_p_role_email_idx', 'users (programme_id, role, email, id)'],
  ['users_p_role_created_idx', 'users (programme_id, role, created_at, id)'],
];
// Superseded by the wider ones above.
const OLD: Array<[string, string]> = [
  ['reminders_log_idx', 'reminders (programme_id, send_at DESC)'],
  ['reminders_infant_idx', 'reminders (infant_id) WHERE infant_id IS NOT NULL'],
  ['users_programme_role_idx', 'users (programme_id, role)'],
  ['users_programme_name_idx', 'users (programme_id, name)'],
];

export class MessageAndPeopleListIndexes1766016000000 implements MigrationInterface {
  name = 'MessageAndPeopleListIndexes1766016000000';

  async up(q: QueryRunner): Promise<void> {
    for (const [name, on] of INDEXES) await q.query(`CREATE INDEX IF NOT EXISTS ${name} ON ${on}`);
    for (const [name] of OLD) await q.query(`DROP INDEX IF EXISTS ${name}`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const [name, on] of OLD) await q.query(`CREATE INDEX IF NOT EXISTS ${name} ON ${on}`);
    for (const [name] of INDEXES) await q.query(`DROP INDEX IF EXISTS ${name}`);
  }
}
