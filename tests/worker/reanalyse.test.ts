import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OXIMETRY_ANALYSIS_VERSION } from '@shared/clinical/oximetry';
import { analyseRecording } from '../../server/modules/recordings/analyse';
import { reanalyseOutdated } from '../../worker/processors/analyse-recording.processor';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';
import { enrolledBaby, uploadRecording } from '../fixtures/recordings/upload';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

describe('re-analysing studies after the rules change', () => {
  it('when a study was analysed by an older version, then the job analyses it again, shows the newest and keeps the old one', async () => {
    const clinic = await makeClinic(ctx.deps);
    const baby = await enrolledBaby(ctx, clinic);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    // 10 min at 96 % with four falls to 92 % of exactly 10 s, 12 s apart: version 1.x lost the 2nd and 4th
    const dips = [300, 322, 344, 366];
    const samples = steadySamples(600, dips.flatMap((d) => Array.from({ length: 10 }, (_, k) => [d + k, { spo2: 92 }] as [number, { spo2: number }])));
    const id = (await uploadRecording(nurse, baby.id, csvFromSamples(samples)).expect(202)).body.id;
    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, id)).toBe('done');
    // pretend it was analysed by the old rules, with the old count
    await ctx.deps.ds.query(`UPDATE recordings SET analysis_version = 'nestflow-oximetry-1.0.0', odi3 = 12 WHERE id = $1`, [id]);
    const { reanalysed } = await reanalyseOutdated(ctx.deps.ds, ctx.deps.repos);
    expect(reanalysed).toBeGreaterThanOrEqual(1);
    const rec = (await nurse.get(`/api/recordings/${id}`).expect(200)).body;
    expect(rec.analysisVersion).toBe(OXIMETRY_ANALYSIS_VERSION);
    expect(rec.summary.odi3).toBeCloseTo(4 / (10 / 60), 9);
    const kept = await ctx.deps.ds.query(`SELECT analysis_version FROM recording_analyses WHERE recording_id = $1 ORDER BY analysed_at`, [id]);
    expect(kept.map((r: { analysis_version: string }) => r.analysis_version)).toEqual([OXIMETRY_ANALYSIS_VERSION, OXIMETRY_ANALYSIS_VERSION]);
    // a second run finds nothing left to do for it
    await reanalyseOutdated(ctx.deps.ds, ctx.deps.repos);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM recording_analyses WHERE recording_id = $1`, [id]);
    expect(n).toBe(2);
  });
});
