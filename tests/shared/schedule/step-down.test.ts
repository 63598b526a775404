import { describe, expect, it } from 'vitest';
import { isJudged, meetsOvernightTarget, nextStepDown, type Setting } from '@shared/schedule/step-down';
import { DEFAULT_POLICY_SETTINGS, type PolicySettings } from '@shared/schemas/policy';

// The step-down ladder is the programme's own (common practice, set in policy): one flowmeter step down at a time
// (default steps 0.025 L/min up to 1 L/min), oxygen only while asleep at or below 0.1 L/min, then off.
const policy = DEFAULT_POLICY_SETTINGS;
const flow = (flowLpm: number): Setting => ({ flowLpm, periods: null });

describe('the next rung of the step-down ladder', () => {
  it('when on 0.5 L/min day and night, then the next rung is one step lower, 0.475 L/min', () => {
    expect(nextStepDown(flow(0.5), policy)).toEqual({ kind: 'lower', setting: { flowLpm: 0.475, periods: null }, label: '0.475 L/min day and night' });
  });

  it('when the policy steps down two steps at a time, then 0.5 goes to 0.45', () => {
    const two: PolicySettings = { ...policy, stepDown: { ...policy.stepDown, stepsPerDecrease: 2 } };
    expect(nextStepDown(flow(0.5), two).setting.flowLpm).toBe(0.45);
  });

  it('when the flow sits between steps, then the next rung is below the step that holds it', () => {
    // 0.49 lies under the 0.5 step: one step down from 0.5 is 0.475, which is below 0.49.
    expect(nextStepDown(flow(0.49), policy).setting.flowLpm).toBe(0.475);
  });

  it('when the flow is above every step, then the next rung is the largest step', () => {
    const steps: PolicySettings = { ...policy, flowmeterStepsLpm: [0.25, 0.5, 1] };
    expect(nextStepDown(flow(1.5), steps)).toMatchObject({ kind: 'lower', setting: { flowLpm: 1 } });
  });

  it('when the flow is at the night-only threshold (0.1 L/min), then the next rung is that flow while asleep only', () => {
    expect(nextStepDown(flow(0.1), policy)).toEqual({
      kind: 'sleep_only',
      setting: { flowLpm: 0.1, periods: { awake: 0, asleep: 0.1, feeding: 0 } },
      label: '0.1 L/min while asleep only',
    });
    expect(nextStepDown(flow(0.125), policy)).toMatchObject({ kind: 'lower', setting: { flowLpm: 0.1 } });
  });

  it('when the flow is already the smallest step above the threshold, then the next rung is asleep only, not below the meter', () => {
    const steps: PolicySettings = { ...policy, flowmeterStepsLpm: [0.5, 1], stepDown: { ...policy.stepDown, sleepOnlyBelowLpm: 0.1 } };
    expect(nextStepDown(flow(0.5), steps)).toMatchObject({ kind: 'sleep_only', setting: { flowLpm: 0.5, periods: { awake: 0, asleep: 0.5, feeding: 0 } } });
  });

  it('when oxygen is given only while asleep, then the next rung is off', () => {
    const sleepOnly: Setting = { flowLpm: 0.1, periods: { awake: 0, asleep: 0.1, feeding: 0 } };
    expect(nextStepDown(sleepOnly, policy)).toEqual({ kind: 'off', setting: { flowLpm: 0, periods: null }, label: 'Off oxygen' });
  });

  it('when periods give oxygen while awake or feeding too, then it is not asleep-only and steps down as a flow', () => {
    expect(nextStepDown({ flowLpm: 0.5, periods: { awake: 0.25, asleep: 0.5, feeding: 0 } }, policy).kind).toBe('lower');
    expect(nextStepDown({ flowLpm: 0.5, periods: { awake: 0, asleep: 0.5, feeding: 0.25 } }, policy).kind).toBe('lower');
    expect(nextStepDown({ flowLpm: 0.5, periods: { awake: 0, asleep: 0, feeding: 0 } }, policy).kind).toBe('lower');
  });

  it('when the flow is already 0, then the next rung is off', () => {
    expect(nextStepDown(flow(0), policy).kind).toBe('off');
    expect(nextStepDown(flow(0.025), policy).kind).toBe('sleep_only');
  });
});

describe('the overnight target', () => {
  // BTS 2009 as cited by the Starship guideline (docs/clinical-sources.md §4.2 [C2]): mean SpO2 ≥ 93 % and < 5 % of the
  // time below 90 %; ≥ 95 % with pulmonary hypertension (Starship [C2]). A study needs 5 h of valid time to be
  // judged (Urschitz 2003, §5.1 [C]).
  const study = (meanSpo2: number | null, pctBelow90: number | null, validMinutes = 480) => ({ meanSpo2, pctBelow90, validMinutes });

  it('when the mean is exactly 93 % and under 5 % is below 90, then the target is met', () => {
    expect(meetsOvernightTarget(study(93, 4.9), policy, false)).toEqual({ met: true, judged: true, reasons: [] });
  });

  it('when the mean is below 93 % or 5 % or more is below 90, then it is not met and the reason says which', () => {
    expect(meetsOvernightTarget(study(92.9, 1), policy, false)).toEqual({ met: false, judged: true, reasons: ['mean SpO2 below 93 %'] });
    expect(meetsOvernightTarget(study(96, 5), policy, false)).toEqual({ met: false, judged: true, reasons: ['5 % or more of the time below 90 %'] });
    expect(meetsOvernightTarget(study(null, null), policy, false).reasons).toHaveLength(2);
  });

  it('when the baby has pulmonary hypertension, then the mean must reach 95 %', () => {
    expect(meetsOvernightTarget(study(94, 1), policy, true).reasons).toEqual(['mean SpO2 below 95 %']);
    expect(meetsOvernightTarget(study(95, 1), policy, true).met).toBe(true);
  });

  it('when the study has less than 5 h of valid time, then it is not judged and meets nothing', () => {
    expect(isJudged(300, policy)).toBe(true);
    expect(isJudged(299, policy)).toBe(false);
    expect(meetsOvernightTarget(study(98, 0, 299), policy, false)).toEqual({ met: false, judged: false, reasons: ['too short to judge: less than 5 hours of valid recording'] });
    const ninety: PolicySettings = { ...policy, oximetry: { ...policy.oximetry, minValidMinutes: 270 } };
    expect(meetsOvernightTarget(study(98, 0, 200), ninety, false).reasons).toEqual(['too short to judge: less than 4.5 hours of valid recording']);
  });
});
