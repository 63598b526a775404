import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Foundation1764633600000 implements MigrationInterface {
  name = 'Foundation1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE programmes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      slug text NOT NULL UNIQUE,
      name text NOT NULL,
      time_zone text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      email text NOT NULL UNIQUE CHECK (email = lower(email)),
      name text NOT NULL,
      role text NOT NULL CHECK (role IN ('admin','coordinator','nurse','consultant','family')),
      password_hash text NOT NULL,
      disabled boolean NOT NULL DEFAULT false,
      disabled_at timestamptz,
      last_sign_in_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX users_programme_role_idx ON users (programme_id, role)`);
    await q.query(`CREATE INDEX users_programme_name_idx ON users (programme_id, name)`);
    await q.query(`CREATE TABLE audit_events (
      id bigserial PRIMARY KEY,
      programme_id uuid REFERENCES programmes(id),
      actor_id uuid REFERENCES users(id),
      action text NOT NULL,
      entity_type text NOT NULL,
      entity_id text,
      details jsonb NOT NULL DEFAULT '{}'::jsonb,
      ip text,
      at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX audit_events_programme_at_idx ON audit_events (programme_id, at)`);
    await q.query(`CREATE INDEX audit_events_entity_idx ON audit_events (entity_type, entity_id)`);
    // The audit trail is evidence: nobody, the application included, may rewrite or remove it.
    await q.query(`CREATE FUNCTION audit_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN RAISE EXCEPTION 'audit_events is append-only'; END $$`);
    await q.query(`CREATE TRIGGER audit_events_no_change BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_append_only()`);
    await q.query(`CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION audit_events_append_only()`);
    // Session store for connect-pg-simple (its documented table), plus an index to end a user's sessions.
    await q.query(`CREATE TABLE session (
      sid varchar NOT NULL PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    )`);
    await q.query(`CREATE INDEX session_expire_idx ON session (expire)`);
    await q.query(`CREATE INDEX session_user_idx ON session (((sess::jsonb -> 'passport') ->> 'user'))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE session`);
    await q.query(`DROP TABLE audit_events`);
    await q.query(`DROP FUNCTION audit_events_append_only()`);
    await q.query(`DROP TABLE users`);
    await q.query(`DROP TABLE programmes`);
  }
}
