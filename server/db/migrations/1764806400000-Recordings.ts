import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Recordings1764806400000 implements MigrationInterface {
  name = 'Recordings1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE recordings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      status text NOT NULL CHECK (status IN ('queued','analysing','done','failed')),
      file_name text NOT NULL,
      sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      byte_size integer NOT NULL CHECK (byte_size > 0),
      time_format text NOT NULL CHECK (time_format IN ('iso','seconds')),
      started_at timestamptz,
      duration_sec double precision NOT NULL CHECK (duration_sec > 0),
      sample_count integer NOT NULL CHECK (sample_count > 0),
      sample_period_sec double precision NOT NULL CHECK (sample_period_sec > 0),
      skipped_rows integer NOT NULL DEFAULT 0 CHECK (skipped_rows >= 0),
      analysis_version text,
      valid_minutes double precision,
      mean_spo2 double precision,
      median_spo2 double precision,
      min_spo2 double precision,
      pct_below_90 double precision,
      pct_below_92 double precision,
      pct_below_93 double precision,
      odi3 double precision,
      odi4 double precision,
      mean_pulse double precision,
      events jsonb,
      failure_reason text,
      uploaded_by uuid NOT NULL REFERENCES users(id),
      uploaded_at timestamptz NOT NULL DEFAULT now(),
      analysed_at timestamptz,
      status_at timestamptz NOT NULL DEFAULT now(),
      -- The same file for the same baby is one recording, whoever retries it and however often.
      UNIQUE (infant_id, sha256),
      CHECK (status <> 'done' OR (analysis_version IS NOT NULL AND valid_minutes IS NOT NULL))
    )`);
    await q.query(`CREATE INDEX recordings_infant_uploaded_idx ON recordings (infant_id, uploaded_at DESC, id)`);
    await q.query(`CREATE INDEX recordings_unfinished_idx ON recordings (status_at) WHERE status IN ('queued','analysing')`);
    await q.query(`CREATE TABLE recording_samples (
      recording_id uuid PRIMARY KEY REFERENCES recordings(id) ON DELETE CASCADE,
      layout smallint NOT NULL,
      sample_count integer NOT NULL,
      offsets bytea NOT NULL,
      spo2 bytea NOT NULL,
      pulse bytea NOT NULL,
      flags bytea NOT NULL,
      CHECK (octet_length(offsets) = 4 * sample_count AND octet_length(spo2) = 2 * sample_count
        AND octet_length(pulse) = 2 * sample_count AND octet_length(flags) = sample_count)
    )`);
    // lz4 (PostgreSQL 14+, in Debian's build) stores a night about 10 ms faster than the default pglz, for ~15 %
    // more bytes: the upload path is measured against a COPY (docs/service-targets.md P4).
    for (const column of ['offsets', 'spo2', 'pulse', 'flags']) {
      await q.query(`ALTER TABLE recording_samples ALTER COLUMN ${column} SET COMPRESSION lz4`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE recording_samples`);
    await q.query(`DROP TABLE recordings`);
  }
}
