import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { SavedMapping } from '@shared/schemas/recordings';

/** Column names compared as the reader compares them: ignoring case and surrounding spaces, in file order. */
export const headerKey = (headers: readonly string[]) =>
  createHash('sha256').update(headers.map((h) => h.trim().toLowerCase()).join('\n')).digest('hex');

export function createColumnMappingsRepository(ds: DataSource) {
  const run = (m?: EntityManager) => m ?? ds.manager;
  return {
    async find(programmeId: string, headers: readonly string[]): Promise<SavedMapping> {
      const rows: Array<{ mapping: NonNullable<SavedMapping> }> = await run().query(
        'SELECT mapping FROM recording_column_mappings WHERE programme_id = $1 AND header_key = $2', [programmeId, headerKey(headers)],
      );
      return rows[0]?.mapping ?? null;
    },
    /** The last mapping used wins: the newest export of a device is the best guess for the next. */
    async save(programmeId: string, headers: readonly string[], mapping: NonNullable<SavedMapping>, userId: string, m?: EntityManager) {
      await run(m).query(
        `INSERT INTO recording_column_mappings (programme_id, header_key, mapping, updated_by) VALUES ($1, $2, $3, $4)
         ON CONFLICT (programme_id, header_key) DO UPDATE SET mapping = EXCLUDED.mapping, updated_by = EXCLUDED.updated_by, updated_at = now()`,
        [programmeId, headerKey(headers), JSON.stringify(mapping), userId],
      );
    },
  };
}
export type ColumnMappingsRepository = ReturnType<typeof createColumnMappingsRepository>;
