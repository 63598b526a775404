import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Studies that can be judged: each recording keeps the minimum event time and minimum valid time it was analysed
 * with and whether it was long enough to judge; every analysis (old versions too) is kept in recording_analyses;
 * a planned check can carry a note (e.g. "repeat needed: the study was too short to judge").
 */
export class StudyJudgement1765238400000 implements MigrationInterface {
  name = 'StudyJudgement1765238400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE recordings ADD COLUMN judged boolean, ADD COLUMN min_event_seconds double precision, ADD COLUMN min_valid_minutes double precision`);
    await q.query(`CREATE TABLE recording_analyses (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      recording_id uuid NOT NULL REFERENCES recordings(id) ON DELETE CASCADE,
      analysis_version text NOT NULL,
      summary jsonb NOT NULL,
      events jsonb NOT NULL DEFAULT '[]'::jsonb,
      analysed_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX recording_analyses_recording ON recording_analyses (recording_id, analysed_at DESC)`);
    // The analyses done so far, kept with their version before any re-analysis replaces the shown summary.
    await q.query(`INSERT INTO recording_analyses (recording_id, analysis_version, summary, events, analysed_at)
      SELECT id, analysis_version, jsonb_build_object('validMinutes', valid_minutes, 'meanSpo2', mean_spo2, 'medianSpo2', median_spo2,
        'minSpo2', min_spo2, 'pctBelow90', pct_below_90, 'pctBelow92', pct_below_92, 'pctBelow93', pct_below_93, 'odi3', odi3, 'odi4', odi4,
        'meanPulse', mean_pulse), coalesce(events, '[]'::jsonb), coalesce(analysed_at, now())
      FROM recordings WHERE status = 'done' AND analysis_version IS NOT NULL`);
    await q.query(`UPDATE recordings SET judged = valid_minutes >= 300, min_valid_minutes = 300, min_event_seconds = 10 WHERE status = 'done'`);
    await q.query(`ALTER TABLE checks ADD COLUMN note text`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE checks DROP COLUMN note`);
    await q.query(`DROP TABLE recording_analyses`);
    await q.query(`ALTER TABLE recordings DROP COLUMN judged, DROP COLUMN min_event_seconds, DROP COLUMN min_valid_minutes`);
  }
}
