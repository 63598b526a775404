import type { DataSource, EntityManager } from 'typeorm';
import type { SqlFilter } from '../../auth/casl-to-sql';
import type { EncodedSamples } from '@shared/recordings/sample-codec';
import { RecordingEntity } from '../entities/recording.entity';
import { RecordingSamplesEntity } from '../entities/recording-samples.entity';

// Recordings carry programme_id and infant_id; nurse rules need the baby's nurse, so the ACL joins infants.
export const RECORDING_ACL_COLUMNS = { programmeId: 'r.programme_id', infantId: 'r.infant_id', nurseId: 'i.nurse_id' };

export type RecordingWithUploader = RecordingEntity & { uploaderName: string | null };

/** The latest analysed study's figures, as stored (numeric columns may arrive as text). */
export interface StudyRow {
  id: string; recorded_at: Date; valid_minutes: number; mean_spo2: number | null; pct_below_90: number | null; odi3: number | null; odi4: number | null;
}

export function createRecordingsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(RecordingEntity);
  const samplesRepo = (m?: EntityManager) => (m ?? ds.manager).getRepository(RecordingSamplesEntity);
  /** One statement: the rows the caller may read, with the uploader's name joined in. */
  const visible = (acl: SqlFilter) =>
    repo()
      .createQueryBuilder('r')
      .innerJoin('infants', 'i', 'i.id = r.infant_id')
      .leftJoin('users', 'u', 'u.id = r.uploaded_by')
      .addSelect('u.name', 'uploader_name')
      .where(acl.sql, acl.params);
  const withUploader = ({ entities, raw }: { entities: RecordingEntity[]; raw: Array<{ r_id: string; uploader_name: string | null }> }) => {
    const names = new Map(raw.map((row) => [row.r_id, row.uploader_name]));
    return entities.map((e): RecordingWithUploader => Object.assign(e, { uploaderName: names.get(e.id) ?? null }));
  };

  return {
    /** What re-analysis needs to know first: whose it is, its state and which rules analysed it. */
    analysisState: async (id: string): Promise<{ programme_id: string; status: string; analysis_version: string | null } | undefined> =>
      (await ds.query(`SELECT programme_id, status, analysis_version FROM recordings WHERE id = $1`, [id]))[0],

    /** Keeps each analysis in recording_analyses with its rules' version, so an earlier summary stays readable. */
    insertAnalysis: (a: { recordingId: string; version: string; summary: unknown; events: unknown; analysedAt: Date }, m: EntityManager): Promise<unknown> =>
      m.query(`INSERT INTO recording_analyses (recording_id, analysis_version, summary, events, analysed_at) VALUES ($1, $2, $3, $4, $5)`, [
        a.recordingId, a.version, JSON.stringify(a.summary), JSON.stringify(a.events), a.analysedAt,
      ]),

    /** Analysed recordings (with samples kept) whose analysis came from other rules than `version`, oldest upload first. */
    outdatedAnalysisIds: (version: string, limit: number): Promise<Array<{ id: string }>> =>
      ds.query(
        `SELECT r.id FROM recordings r WHERE r.status = 'done' AND r.analysis_version IS DISTINCT FROM $1
           AND EXISTS (SELECT 1 FROM recording_samples s WHERE s.recording_id = r.id) ORDER BY r.uploaded_at LIMIT $2`,
        [version, limit],
      ),

    /** The baby's latest analysed recording (by when it was recorded, else uploaded), as the step-down rules read it. */
    latestDoneStudy: async (infantId: string, m: EntityManager): Promise<StudyRow | undefined> =>
      ((await m.query(
        `SELECT id, coalesce(started_at, uploaded_at) AS recorded_at, valid_minutes, mean_spo2, pct_below_90, odi3, odi4
           FROM recordings WHERE infant_id = $1 AND status = 'done' ORDER BY coalesce(started_at, uploaded_at) DESC LIMIT 1`,
        [infantId],
      )) as StudyRow[])[0],

    findVisible: async (id: string, acl: SqlFilter) =>
      withUploader(await visible(acl).andWhere('r.id = :id', { id }).getRawAndEntities<{ r_id: string; uploader_name: string | null }>())[0] ?? null,

    /** Newest first, paged in SQL; the total comes from the same statement's window count. */
    listForInfant: async (infantId: string, acl: SqlFilter, page: number, pageSize: number) => {
      const qb = visible(acl)
        .addSelect('count(*) OVER()', 'total')
        .andWhere('r.infant_id = :infantId', { infantId })
        .orderBy('r.uploaded_at', 'DESC')
        .addOrderBy('r.id', 'DESC')
        .offset((page - 1) * pageSize)
        .limit(pageSize);
      const result = await qb.getRawAndEntities<{ r_id: string; uploader_name: string | null; total: string }>();
      return { items: withUploader(result), total: result.raw.length ? Number(result.raw[0].total) : 0 };
    },

    findBySha: (infantId: string, sha256: string, m?: EntityManager) => repo(m).findOne({ where: { infantId, sha256 }, select: { id: true } }),
    findForUpdate: (id: string, m: EntityManager) => repo(m).createQueryBuilder('r').setLock('pessimistic_write').where('r.id = :id', { id }).getOne(),
    /** The new recording's id, or null when this baby already has this file (ON CONFLICT: no error, no lost transaction). */
    insertIfNew: async (data: Partial<RecordingEntity>, m: EntityManager): Promise<string | null> => {
      const result = await repo(m).createQueryBuilder().insert().into(RecordingEntity).values(data).orIgnore().returning('id').execute();
      return (result.raw as Array<{ id: string }>)[0]?.id ?? null;
    },
    save: (recording: RecordingEntity, m: EntityManager) => repo(m).save(recording),

    insertSamples: (recordingId: string, layout: number, encoded: EncodedSamples, m: EntityManager) =>
      samplesRepo(m).insert({
        recordingId, layout, sampleCount: encoded.count,
        offsets: bytes(encoded.offsets), spo2: bytes(encoded.spo2), pulse: bytes(encoded.pulse), flags: bytes(encoded.flags),
      }),
    loadSamples: async (recordingId: string): Promise<(EncodedSamples & { layout: number }) | null> => {
      const row = await samplesRepo().findOne({ where: { recordingId } });
      if (!row) return null;
      return { layout: row.layout, count: row.sampleCount, offsets: row.offsets, spo2: row.spo2, pulse: row.pulse, flags: row.flags };
    },

    /** Ids left waiting (Redis was away at upload) or half-done (a worker died): the reconciler enqueues these. */
    stale: async (queuedSeconds: number, analysingSeconds: number): Promise<string[]> => {
      const rows: Array<{ id: string }> = await ds.query(
        `SELECT id FROM recordings
          WHERE (status = 'queued' AND status_at < now() - make_interval(secs => $1))
             OR (status = 'analysing' AND status_at < now() - make_interval(secs => $2))
          ORDER BY status_at LIMIT 1000`,
        [queuedSeconds, analysingSeconds],
      );
      return rows.map((r) => r.id);
    },
  };
}
export type RecordingsRepository = ReturnType<typeof createRecordingsRepository>;

// A view on the same memory, so a 389 kB array is not copied again on its way to the driver.
const bytes = (a: Uint8Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);
