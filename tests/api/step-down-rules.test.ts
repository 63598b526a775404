import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { fixedClock } from '../../server/lib/clock';
import { analyseRecording } from '../../server/modules/recordings/analyse';
import { afterStudy } from '../../server/modules/step-downs/after-study';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { approvedBaby, post } from '../helpers/approved-baby';
import { signedInAgent } from '../helpers/agents';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';
import { uploadRecording } from '../fixtures/recordings/upload';

// Every rule is checked at a fixed instant; the baby's dates are set relative to it, so the run never depends on
// the hour or day it happens. Rule defaults and sources: shared/schedule/step-down-rules.ts.
const NOW = new Date('2027-03-15T12:00:00Z');
const ago = (days: number) => new Date(NOW.getTime() - days * 86_400_000);

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(() => ctx.close());

/** A baby approved `daysOnSetting` days before NOW, with (optionally) a study and staff readings. */
async function baby(opts: { daysOnSetting: number; study?: { daysAgo: number; validMinutes: number; meanSpo2: number; pctBelow90: number }; readings?: number[]; flags?: string[] }) {
  const b = await approvedBaby(ctx.deps, ctx.app);
  const { infant, clinic } = b;
  await ctx.deps.ds.query(`UPDATE prescriptions SET decided_at = $2 WHERE infant_id = $1 AND status = 'active'`, [infant.id, ago(opts.daysOnSetting)]);
  if (opts.flags) await ctx.deps.ds.query(`UPDATE infants SET flags = $2 WHERE id = $1`, [infant.id, opts.flags]);
  let recordingId: string | null = null;
  if (opts.study) {
    const s = opts.study;
    [{ id: recordingId }] = await ctx.deps.ds.query(
      `INSERT INTO recordings (programme_id, infant_id, status, file_name, sha256, byte_size, time_format, started_at, duration_sec, sample_count,
         sample_period_sec, analysis_version, valid_minutes, mean_spo2, pct_below_90, odi3, odi4, judged, uploaded_by)
       VALUES ($1, $2, 'done', 'night.csv', $3, 100, 'iso', $4, $5, $6, 1, 'test', $7, $8, $9, 2.5, 1.1, $10, $11) RETURNING id`,
      [clinic.programme.id, infant.id, randomBytes(32).toString('hex'), ago(s.daysAgo), s.validMinutes * 60, s.validMinutes * 60, s.validMinutes, s.meanSpo2, s.pctBelow90,
        s.validMinutes >= 300, clinic.people.nurse.id],
    );
  }
  for (const [i, spo2] of (opts.readings ?? []).entries()) {
    await ctx.deps.ds.query(
      `INSERT INTO readings (programme_id, infant_id, taken_at, spo2, state, family_reported, created_by) VALUES ($1, $2, $3, $4, 'asleep', false, $5)`,
      [clinic.programme.id, infant.id, ago(i + 1), spo2, clinic.people.nurse.id],
    );
  }
  const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
  return { ...b, nurse, recordingId };
}

const ready = { daysOnSetting: 20, study: { daysAgo: 2, validMinutes: 480, meanSpo2: 95.5, pctBelow90: 0.8 }, readings: [95, 96, 94] };

describe('asking for a step down against the programme rules', () => {
  it('when asked on the first day home with no study and a low-SpO2 flag, then 422 lists every unmet rule and nothing is stored', async () => {
    const { infant, nurse } = await baby({ daysOnSetting: 0.5, flags: ['below_target'] });
    const res = await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Looks well' }).expect(422);
    expect(res.body.error).toMatchObject({ code: 'policy_not_met' });
    expect(res.body.error.details.unmet.map((u: { code: string }) => u.code)).toEqual(['time_on_setting', 'study_judged', 'study_on_target', 'no_open_flags', 'readings_in_range']);
    expect(res.body.error.details.unmet[0].message).toBe('On the current setting for 0 days; the programme asks for at least 14 days.');
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM prescriptions WHERE infant_id = $1`, [infant.id]);
    expect(n).toBe(1);
  });

  it('when the nurse previews, then the form gets the same rules and the step that would be proposed', async () => {
    const { infant, nurse } = await baby({ daysOnSetting: 3 });
    const preview = (await nurse.get(`/api/infants/${infant.id}/step-down-checks`).expect(200)).body;
    expect(preview.next).toMatchObject({ kind: 'lower', flowLpm: expect.any(Number) });
    expect(preview.blockedReason).toBeNull();
    expect(preview.checks.filter((c: { met: boolean }) => !c.met).map((c: { code: string }) => c.code)).toEqual(['time_on_setting', 'study_judged', 'study_on_target', 'readings_in_range']);
  });

  it('when an override reason is too short, then 400; when given, then 201 with the unmet rules recorded and audited', async () => {
    const { infant, nurse, clinic } = await baby({ daysOnSetting: 3 });
    const short = await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Ready', overrideReason: 'because' }).expect(400);
    expect(Object.keys(short.body.error.details)).toEqual(['overrideReason']);
    const override = 'Consultant asked on the ward round to try the lower step now';
    const rx = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Feeding and growing well', overrideReason: override }).expect(201)).body;
    expect(rx.evidence).toMatchObject({ reason: 'Feeding and growing well', overrideReason: override, requestedBy: { id: clinic.people.nurse.id, name: clinic.people.nurse.name } });
    const [audit] = await ctx.deps.ds.query(`SELECT details FROM audit_events WHERE entity_id = $1 AND action = 'step_down.requested_against_rules'`, [infant.id]);
    expect(audit.details).toMatchObject({ prescriptionId: rx.id, overrideReason: override, unmet: ['time_on_setting', 'study_judged', 'study_on_target', 'readings_in_range'] });
  });

  it('when every rule is met, then 201 without an override, and the consultant sees the evidence; the family sees none of it', async () => {
    const { infant, nurse, consultant, family, recordingId } = await baby({ ...ready, flags: ['growth_drift'] });
    const rx = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Settled nights, gaining weight' }).expect(201)).body;
    const seen = (await consultant.get(`/api/prescriptions/${rx.id}`).expect(200)).body;
    expect(seen.evidence.checks.every((c: { met: boolean }) => c.met)).toBe(true);
    expect(seen.evidence.study).toEqual({
      recordingId, recordedAt: ago(2).toISOString(), validMinutes: 480, meanSpo2: 95.5, pctBelow90: 0.8, odi3: 2.5, odi4: 1.1, judged: true,
    });
    // newest first
    expect(seen.evidence.readings.map((r: { spo2: number }) => r.spo2)).toEqual([95, 96, 94]);
    expect(seen.evidence.flags).toEqual(['growth_drift']);
    expect(seen.evidence.overrideReason).toBeNull();
    const queue = (await consultant.get('/api/prescriptions/queue').expect(200)).body.items;
    expect(queue.find((q: { prescriptionId: string }) => q.prescriptionId === rx.id)).toMatchObject({ unmetChecks: 0 });
    const own = (await family.get(`/api/prescriptions/${rx.id}`));
    // families read approved settings only; a proposal is not theirs to see, and nothing staff-only leaks either way
    if (own.status === 200) expect(own.body).toMatchObject({ evidence: null, input: {}, conversion: null, decisionReason: null });
    else expect(own.status).toBe(404);
  });

  it('when a proposal was asked for against the rules, then the queue counts them and approval needs the consultant’s reason', async () => {
    const { infant, nurse, consultant } = await baby({ ...ready, readings: [95, 89] });
    const rx = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Ready', overrideReason: 'The low reading was a poor trace while crying' }).expect(201)).body;
    const queue = (await consultant.get('/api/prescriptions/queue').expect(200)).body.items;
    expect(queue.find((q: { prescriptionId: string }) => q.prescriptionId === rx.id)).toMatchObject({ unmetChecks: 1 });
    const refused = await post(consultant, `/api/prescriptions/${rx.id}/decision`, { decision: 'approve' }).expect(400);
    expect(refused.body.error.details.reason[0]).toMatch(/step-down rule\(s\) not met/);
    await post(consultant, `/api/prescriptions/${rx.id}/decision`, { decision: 'approve', reason: 'Reviewed the trace: artefact' }).expect(200);
    const [audit] = await ctx.deps.ds.query(`SELECT details FROM audit_events WHERE entity_id = $1 AND action = 'prescription.approved' ORDER BY id DESC LIMIT 1`, [infant.id]);
    expect(audit.details).toMatchObject({ prescriptionId: rx.id, reason: 'Reviewed the trace: artefact', approvedAgainstRules: ['readings_in_range'] });
  });

  it('when the latest study was too short to judge, then it counts for nothing and the rule says a repeat is needed', async () => {
    const { infant, nurse } = await baby({ ...ready, study: { daysAgo: 1, validMinutes: 60, meanSpo2: 97, pctBelow90: 0 } });
    const res = await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Ready' }).expect(422);
    expect(res.body.error.details.unmet).toEqual([
      { code: 'study_judged', message: 'The latest study has 1 h of valid recording, less than the 5 h needed to judge it: repeat the study.' },
      { code: 'study_on_target', message: 'A study too short to judge does not count for or against the target.' },
    ]);
  });
});

describe('a study too short to judge', () => {
  it('when a 1-hour night is uploaded, then it is "too short to judge", the planned overnight study stays open with a repeat note', async () => {
    const { infant, clinic, nurse } = await baby({ daysOnSetting: 20 });
    await ctx.deps.ds.query(
      `INSERT INTO checks (programme_id, infant_id, plan_key, kind, due_at, due_date, status) VALUES ($1, $2, 'study-test', 'overnight_study', now(), current_date, 'planned')`,
      [clinic.programme.id, infant.id],
    );
    const id = (await uploadRecording(nurse, infant.id, csvFromSamples(steadySamples(3600))).expect(202)).body.id;
    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, id)).toBe('done');
    await afterStudy(ctx.deps.ds, ctx.deps.repos, id);
    const rec = (await nurse.get(`/api/recordings/${id}`).expect(200)).body;
    expect(rec.summary).toMatchObject({ judged: false, validMinutes: 60, minValidMinutes: 300, minEventSeconds: 10 });
    const schedule = (await nurse.get(`/api/infants/${infant.id}/schedule`).expect(200)).body;
    const open = [...schedule.upcoming, ...schedule.overdue].find((c: { planKey: string }) => c.planKey === 'study-test');
    expect(open).toMatchObject({ status: 'planned', note: expect.stringMatching(/^Repeat needed: the recording of .* had less than 5 hours of valid time, too short to judge\.$/) });
    expect(schedule.done.some((c: { planKey: string }) => c.planKey === 'study-test')).toBe(false);
    // nor does it raise or clear a flag
    expect((await nurse.get(`/api/infants/${infant.id}`)).body.flags).not.toContain('below_target');
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM recording_analyses WHERE recording_id = $1`, [id]);
    expect(n).toBe(1);
  });
});
