import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts without a password until their owner sets one from an e-mailed link (set-up tokens, stored hashed,
 * single use, expiring), and a version on readings so two corrections of one reading cannot both win.
 */
export class AccountSetupAndReadingVersions1765411200000 implements MigrationInterface {
  name = 'AccountSetupAndReadingVersions1765411200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users ALTER COLUMN password_hash DROP NOT NULL`);
    await q.query(`ALTER TABLE users ADD COLUMN password_changed_at timestamptz`);
    await q.query(`CREATE TABLE account_setup_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      token_hash text NOT NULL UNIQUE,
      created_by uuid REFERENCES users(id),
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX account_setup_tokens_user_idx ON account_setup_tokens (user_id) WHERE used_at IS NULL AND revoked_at IS NULL`);
    await q.query(`ALTER TABLE readings ADD COLUMN row_version integer NOT NULL DEFAULT 1`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE readings DROP COLUMN row_version`);
    await q.query(`DROP TABLE account_setup_tokens`);
    await q.query(`ALTER TABLE users DROP COLUMN password_changed_at`);
    // Accounts still waiting for their owner get an unusable hash (no argon2 string verifies against it).
    await q.query(`UPDATE users SET password_hash = '!' WHERE password_hash IS NULL`);
    await q.query(`ALTER TABLE users ALTER COLUMN password_hash SET NOT NULL`);
  }
}
