import { describe, expect, it } from 'vitest';
import { endOfLocalDay, localDate, planChecks, type PlanState } from '@shared/schedule/plan-checks';
import { DEFAULT_POLICY_SETTINGS as policy } from '@shared/schemas/policy';

const TZ = 'Europe/London';
// Fixed clock: a Wednesday in March, four days before the UK clocks go forward (29 March 2026, 01:00 UTC).
const NOW = new Date('2026-03-25T10:00:00Z');
const home = (over: Partial<PlanState> = {}): PlanState => ({
  homeStartAt: new Date('2026-03-25T09:30:00Z'),
  status: 'on_oxygen',
  active: { version: 1, approvedAt: new Date('2026-03-25T09:30:00Z'), reason: 'enrolment', flowLpm: 0.25 },
  offOxygenSince: null,
  ...over,
});

describe('routine checks from policy (common practice defaults: 72 h, weekly ×4, then every 4 weeks)', () => {
  // Planned inside each test (not in the describe body), so a mutation run knows which tests read the plan.
  const plan = () => planChecks(home(), policy, TZ, NOW);
  const byKey = () => Object.fromEntries(plan().map((c) => [c.planKey, c]));

  it('when a baby goes home, then the first spot check is due within 72 hours of the approval', () => {
    expect(byKey()['first-home'].kind).toBe('spot_check');
    expect(byKey()['first-home'].dueAt.toISOString()).toBe('2026-03-28T09:30:00.000Z');
  });

  it('when weekly checks cross the change to summer time, then each is due at 23:59 local on the right day', () => {
    expect(byKey()['week-1'].dueDate).toBe('2026-04-01');
    // 23:59 BST is 22:59 UTC after the change; 23:59 GMT would be 23:59 UTC.
    expect(byKey()['week-1'].dueAt.toISOString()).toBe('2026-04-01T22:59:00.000Z');
    expect(byKey()['week-4'].dueDate).toBe('2026-04-22');
  });

  it('when the weekly run ends, then four-weekly checks follow up to the planning horizon only', () => {
    expect(byKey()['every-4w-1'].dueDate).toBe('2026-05-20');
    const horizon = NOW.getTime() + policy.schedule.planAheadWeeks * 7 * 86_400_000;
    expect(plan().every((c) => c.planKey === 'first-home' || c.dueAt.getTime() <= horizon)).toBe(true);
    expect(plan().filter((c) => c.planKey.startsWith('every-'))).toHaveLength(1);
  });

  it('when on an approved setting, then an overnight study and a step-down review are planned for that version', () => {
    expect(byKey()['study-before-step-down-v1']).toMatchObject({ kind: 'overnight_study', dueDate: '2026-04-06' });
    expect(byKey()['step-down-review-v1']).toMatchObject({ kind: 'step_down_review', dueDate: '2026-04-08' });
  });

  it('when the same state is planned twice, then the keys and times are identical (a re-plan never duplicates)', () => {
    expect(planChecks(home(), policy, TZ, NOW)).toEqual(plan());
    expect(new Set(plan().map((c) => c.planKey)).size).toBe(plan().length);
  });
});

describe('state-dependent checks', () => {
  it('when the baby is not home yet or has left, then nothing is planned', () => {
    expect(planChecks(home({ status: 'awaiting_signoff' }), policy, TZ, NOW)).toEqual([]);
    expect(planChecks(home({ homeStartAt: null }), policy, TZ, NOW)).toEqual([]);
    expect(planChecks(home({ status: 'left_programme' }), policy, TZ, NOW)).toEqual([]);
  });

  it('when a step down was approved, then a follow-up overnight study is due a week later', () => {
    const approvedAt = new Date('2026-04-10T11:00:00Z');
    const plan = planChecks(home({ status: 'stepping_down', active: { version: 3, approvedAt, reason: 'step_down', flowLpm: 0.2 } }), policy, TZ, NOW);
    expect(plan.find((c) => c.planKey === 'follow-up-v3')).toMatchObject({ kind: 'overnight_study', dueDate: '2026-04-17' });
  });

  it('when off oxygen, then a room-air challenge is due after the observation period and no step-down review', () => {
    const off = new Date('2026-04-01T08:00:00Z');
    const plan = planChecks(home({ status: 'off_oxygen', offOxygenSince: off, active: { version: 4, approvedAt: off, reason: 'step_down', flowLpm: 0 } }), policy, TZ, NOW);
    expect(plan.find((c) => c.kind === 'room_air_challenge')).toMatchObject({ planKey: 'room-air-2026-04-01', dueDate: '2026-04-29' });
    expect(plan.some((c) => c.kind === 'step_down_review')).toBe(false);
  });
});

describe('local days across daylight-saving changes', () => {
  it('when the clocks go back in October, then the end of the local day is 23:59 GMT', () => {
    expect(endOfLocalDay(new Date('2026-10-24T12:00:00Z'), 1, TZ).toISOString()).toBe('2026-10-25T23:59:00.000Z');
    expect(localDate(new Date('2026-10-25T23:30:00Z'), TZ)).toBe('2026-10-25');
    expect(localDate(new Date('2026-03-29T23:30:00Z'), TZ)).toBe('2026-03-30');
  });
});

describe('which states plan which checks', () => {
  const keys = (over: Partial<PlanState>, p = policy) => planChecks(home(over), p, TZ, NOW).map((c) => c.planKey);

  it('when the baby is being prepared or the plan was sent back, then nothing is planned yet', () => {
    expect(keys({ status: 'preparing' })).toEqual([]);
    expect(keys({ status: 'sent_back' })).toEqual([]);
    expect(keys({ status: 'on_oxygen' }).length).toBeGreaterThan(0);
  });

  it('when the status is off oxygen but no date is known, or a date is kept on an oxygen status, then no room-air challenge', () => {
    expect(keys({ status: 'off_oxygen', offOxygenSince: null }).some((k) => k.startsWith('room-air'))).toBe(false);
    expect(keys({ offOxygenSince: new Date('2026-04-01T08:00:00Z') }).some((k) => k.startsWith('room-air'))).toBe(false);
  });

  it('when there is no active setting or it gives no flow, then only the routine checks are planned', () => {
    const routine = keys({ active: null });
    expect(routine.some((k) => k.startsWith('step-down-review') || k.startsWith('study-before'))).toBe(false);
    expect(keys({ active: { version: 2, approvedAt: NOW, reason: 'enrolment', flowLpm: 0 } })).toEqual(routine);
    expect(keys({ active: { version: 2, approvedAt: NOW, reason: 'enrolment', flowLpm: 0.025 } })).toContain('step-down-review-v2');
  });

  it('when a setting was stepped back up, then a follow-up study is planned for it too; an enrolment setting has none', () => {
    // A failed follow-up steps back up (docs/product-rules.md "Stepping down"); the new setting is checked like a step down (common practice).
    expect(keys({ active: { version: 5, approvedAt: NOW, reason: 'step_up', flowLpm: 0.3 } })).toContain('follow-up-v5');
    expect(keys({}).some((k) => k.startsWith('follow-up'))).toBe(false);
  });

  it('when the programme plans no study before a step down, then only the review is planned', () => {
    const noStudy = { ...policy, schedule: { ...policy.schedule, overnightStudyBeforeStepDown: false } };
    expect(keys({}, noStudy)).toContain('step-down-review-v1');
    expect(keys({}, noStudy).some((k) => k.startsWith('study-before'))).toBe(false);
  });

  it('when a repeat check falls exactly on the planning horizon, then it is planned; the next one is not', () => {
    // The horizon is inclusive: "up to N weeks ahead" (policy planAheadWeeks).
    const first = planChecks(home(), policy, TZ, NOW).find((c) => c.planKey === 'every-4w-1')!;
    const now = new Date(first.dueAt.getTime() - policy.schedule.planAheadWeeks * 7 * 86_400_000);
    const planned = planChecks(home(), policy, TZ, now).map((c) => c.planKey);
    expect(planned).toContain('every-4w-1');
    expect(planned).not.toContain('every-4w-2');
  });

  it('when a record has been open for decades, then the repeating checks stop at 999', () => {
    const weekly = { ...policy, schedule: { ...policy.schedule, thenEveryWeeks: 1 } };
    const later = new Date(NOW.getTime() + 30 * 365 * 86_400_000);
    expect(planChecks(home(), weekly, TZ, later).filter((c) => c.planKey.startsWith('every-'))).toHaveLength(999);
  });
});

