import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The column mapping last used for a device export, per programme, keyed by the SHA-256 of its column names: the
 * next file with the same names is offered the same choices.
 */
export class RecordingColumnMappings1765497600000 implements MigrationInterface {
  name = 'RecordingColumnMappings1765497600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE recording_column_mappings (
      programme_id uuid NOT NULL REFERENCES programmes(id),
      header_key text NOT NULL CHECK (header_key ~ '^[0-9a-f]{64}$'),
      mapping jsonb NOT NULL,
      updated_by uuid REFERENCES users(id),
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (programme_id, header_key)
    )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE recording_column_mappings`);
  }
}
