import type { MigrationInterface, QueryRunner } from 'typeorm';

// Reads of a baby's record join the write trail in `audit_events` (kind 'read' beside 'write'), and every row is
// hash-chained: one chain per programme (rows without a programme share the all-zero chain id), each row holding
// its place (`chain_seq`), the hash of the row before it (`prev_hash`) and the SHA-256 of its own canonical content,
// previous hash included (`row_hash`). A BEFORE INSERT trigger fills the three from the chain's head row, which it
// locks until the inserting transaction ends, so concurrent processes extend each chain one row at a time and a
// write and its audit row still commit together. The canonical content is defined once, in `audit_event_hash`;
// the verification (server/audit/chain-verify.ts) asks the database for it, so nothing recomputes it differently.

const NO_CHAIN = '00000000-0000-0000-0000-000000000000';
const GENESIS = '0'.repeat(64);

export class AuditReadsAndChain1766102400000 implements MigrationInterface {
  name = 'AuditReadsAndChain1766102400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE audit_events
      ADD COLUMN kind text NOT NULL DEFAULT 'write' CHECK (kind IN ('write', 'read')),
      ADD COLUMN chain_seq bigint, ADD COLUMN prev_hash text, ADD COLUMN row_hash text`);
    // Timestamps go in as UTC text with microseconds, so the session's time zone never changes a hash.
    await q.query(`CREATE FUNCTION audit_event_hash(e audit_events) RETURNS text LANGUAGE sql STABLE AS $$
      SELECT encode(sha256(convert_to(jsonb_build_array(
        e.id, e.programme_id, e.actor_id, e.kind, e.action, e.entity_type, e.entity_id, e.details, e.ip,
        to_char(e.at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"'), e.chain_seq, e.prev_hash)::text, 'UTF8')), 'hex')
    $$`);
    await q.query(`CREATE TABLE audit_chain_heads (
      chain_id uuid PRIMARY KEY,
      last_seq bigint NOT NULL DEFAULT 0,
      last_hash text NOT NULL DEFAULT '${GENESIS}',
      last_id bigint
    )`);
    await q.query(`CREATE FUNCTION audit_events_chain() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        k uuid := coalesce(NEW.programme_id, '${NO_CHAIN}'::uuid);
        h audit_chain_heads%ROWTYPE;
      BEGIN
        SELECT * INTO h FROM audit_chain_heads WHERE chain_id = k FOR UPDATE;
        IF NOT FOUND THEN
          INSERT INTO audit_chain_heads (chain_id) VALUES (k) ON CONFLICT DO NOTHING;
          SELECT * INTO h FROM audit_chain_heads WHERE chain_id = k FOR UPDATE;
        END IF;
        NEW.chain_seq := h.last_seq + 1;
        NEW.prev_hash := h.last_hash;
        NEW.row_hash := audit_event_hash(NEW);
        UPDATE audit_chain_heads SET last_seq = NEW.chain_seq, last_hash = NEW.row_hash, last_id = NEW.id WHERE chain_id = k;
        RETURN NEW;
      END $$`);

    // Chain the rows already there, in the order they were written.
    await q.query(`ALTER TABLE audit_events DISABLE TRIGGER audit_events_no_change`);
    await q.query(`DO $$
      DECLARE r audit_events%ROWTYPE; k uuid; h audit_chain_heads%ROWTYPE;
      BEGIN
        FOR r IN SELECT * FROM audit_events ORDER BY id LOOP
          k := coalesce(r.programme_id, '${NO_CHAIN}'::uuid);
          INSERT INTO audit_chain_heads (chain_id) VALUES (k) ON CONFLICT DO NOTHING;
          SELECT * INTO h FROM audit_chain_heads WHERE chain_id = k;
          r.chain_seq := h.last_seq + 1;
          r.prev_hash := h.last_hash;
          r.row_hash := audit_event_hash(r);
          UPDATE audit_events SET chain_seq = r.chain_seq, prev_hash = r.prev_hash, row_hash = r.row_hash WHERE id = r.id;
          UPDATE audit_chain_heads SET last_seq = r.chain_seq, last_hash = r.row_hash, last_id = r.id WHERE chain_id = k;
        END LOOP;
      END $$`);
    await q.query(`ALTER TABLE audit_events ENABLE TRIGGER audit_events_no_change`);
    await q.query(`ALTER TABLE audit_events ALTER COLUMN chain_seq SET NOT NULL, ALTER COLUMN prev_hash SET NOT NULL,
      ALTER COLUMN row_hash SET NOT NULL`);
    await q.query(`CREATE TRIGGER audit_events_chain BEFORE INSERT ON audit_events FOR EACH ROW EXECUTE FUNCTION audit_events_chain()`);
    await q.query(`CREATE UNIQUE INDEX audit_events_chain_idx ON audit_events ((coalesce(programme_id, '${NO_CHAIN}'::uuid)), chain_seq)`);
    // "Who looked at this baby's record": newest first, by baby.
    await q.query(`CREATE INDEX audit_events_reads_idx ON audit_events (entity_id, at DESC, id DESC) WHERE kind = 'read'`);

    // The result of every verification: the scheduled job's and an admin's.
    await q.query(`CREATE TABLE audit_chain_checks (
      id bigserial PRIMARY KEY,
      chain_id uuid NOT NULL,
      checked_at timestamptz NOT NULL,
      checked_by uuid REFERENCES users(id),
      ok boolean NOT NULL,
      rows_checked bigint NOT NULL,
      last_seq bigint NOT NULL,
      broken_row_id bigint,
      broken_row_at timestamptz,
      broken_seq bigint,
      problem text
    )`);
    await q.query(`CREATE INDEX audit_chain_checks_chain_idx ON audit_chain_checks (chain_id, checked_at DESC, id DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE audit_chain_checks`);
    await q.query(`DROP TRIGGER audit_events_chain ON audit_events`);
    await q.query(`DROP FUNCTION audit_events_chain()`);
    await q.query(`DROP TABLE audit_chain_heads`);
    await q.query(`DROP INDEX audit_events_reads_idx`);
    await q.query(`DROP INDEX audit_events_chain_idx`);
    // Reads were never part of the write trail before this migration; they go with it.
    await q.query(`ALTER TABLE audit_events DISABLE TRIGGER audit_events_no_change`);
    await q.query(`DELETE FROM audit_events WHERE kind = 'read'`);
    await q.query(`ALTER TABLE audit_events ENABLE TRIGGER audit_events_no_change`);
    await q.query(`DROP FUNCTION audit_event_hash(audit_events)`);
    await q.query(`ALTER TABLE audit_events DROP COLUMN kind, DROP COLUMN chain_seq, DROP COLUMN prev_hash, DROP COLUMN row_hash`);
  }
}
