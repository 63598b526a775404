import { describe, expect, it } from 'vitest';
import { checkStepDownRules, unmetInEvidence, unmetRules, type StepDownFacts } from '@shared/schedule/step-down-rules';
import { DEFAULT_POLICY_SETTINGS, type PolicySettings } from '@shared/schemas/policy';

// Defaults and their sources are listed in shared/schedule/step-down-rules.ts: 14 days on a setting (common
// practice), a study within 7 days (common practice) of ≥ 5 h valid time (Urschitz 2003), mean ≥ 93 % and < 5 % of
// time below 90 % (BTS 2009, TSANZ 2020), spot readings mean ≥ 93 % (NHS GGC) and none ≤ 90 % (ATS 2019).
const NOW = new Date('2026-11-30T12:00:00Z');
const daysAgo = (d: number) => new Date(NOW.getTime() - d * 86_400_000);
const P: PolicySettings = DEFAULT_POLICY_SETTINGS;

const ready: StepDownFacts = {
  now: NOW,
  settingApprovedAt: daysAgo(20),
  approvedWeightKg: 3.1,
  latestWeightKg: 3.4,
  pulmonaryHypertension: false,
  flags: [],
  study: { recordedAt: daysAgo(2), validMinutes: 480, meanSpo2: 95.2, pctBelow90: 1.1 },
  readings: [{ takenAt: daysAgo(1), spo2: 95 }, { takenAt: daysAgo(3), spo2: 94 }],
};
const byCode = (f: StepDownFacts, p = P) => Object.fromEntries(checkStepDownRules(f, p).map((c) => [c.code, c]));

describe('step-down rules', () => {
  it('when every rule holds, then all six are met, in a fixed order', () => {
    const checks = checkStepDownRules(ready, P);
    expect(checks.map((c) => c.code)).toEqual(['time_on_setting', 'study_judged', 'study_on_target', 'no_open_flags', 'readings_in_range', 'weight_not_falling']);
    expect(unmetRules(checks)).toEqual([]);
    expect(byCode(ready).time_on_setting.message).toBe('On the current setting for 20 days; the programme asks for at least 14 days.');
  });

  it('when the baby has been home one day, then time on setting is not met; at exactly 14 days it is', () => {
    expect(byCode({ ...ready, settingApprovedAt: daysAgo(1) }).time_on_setting).toMatchObject({ met: false, message: 'On the current setting for 1 day; the programme asks for at least 14 days.' });
    expect(byCode({ ...ready, settingApprovedAt: daysAgo(14) }).time_on_setting.met).toBe(true);
    expect(byCode({ ...ready, settingApprovedAt: daysAgo(13.9) }).time_on_setting.met).toBe(false);
    expect(byCode({ ...ready, settingApprovedAt: null }).time_on_setting.met).toBe(false);
  });

  it('when there is no study, or it is older than the window, then both study rules are unmet', () => {
    const none = byCode({ ...ready, study: null });
    expect(none.study_judged).toMatchObject({ met: false, message: 'No overnight study has been analysed. A study from the last 7 days is needed.' });
    expect(none.study_on_target.met).toBe(false);
    const old = byCode({ ...ready, study: { ...ready.study!, recordedAt: daysAgo(7.01) } });
    expect(old.study_judged.message).toMatch(/^The latest overnight study is older than 7 days\./);
    expect(byCode({ ...ready, study: { ...ready.study!, recordedAt: daysAgo(7) } }).study_judged.met).toBe(true);
  });

  it('when the study is too short to judge, then it counts neither for nor against the target', () => {
    // Urschitz 2003 excluded studies with < 5 h artefact-free time (docs/clinical-sources.md §5.1)
    const short = byCode({ ...ready, study: { ...ready.study!, validMinutes: 60, meanSpo2: 99, pctBelow90: 0 } });
    expect(short.study_judged).toMatchObject({ met: false, message: 'The latest study has 1 h of valid recording, less than the 5 h needed to judge it: repeat the study.' });
    expect(short.study_on_target.message).toBe('A study too short to judge does not count for or against the target.');
    expect(byCode({ ...ready, study: { ...ready.study!, validMinutes: 300 } }).study_judged.met).toBe(true);
    expect(byCode({ ...ready, study: { ...ready.study!, validMinutes: 299.9 } }).study_judged.met).toBe(false);
  });

  it('when the study misses the target, then that rule says which part (BTS 2009: mean ≥ 93 %, < 5 % below 90 %)', () => {
    const low = byCode({ ...ready, study: { ...ready.study!, meanSpo2: 92.9 } });
    expect(low.study_on_target).toMatchObject({ met: false, message: 'The latest study is below the overnight target: mean SpO2 below 93 %.' });
    expect(byCode({ ...ready, study: { ...ready.study!, pctBelow90: 5 } }).study_on_target.met).toBe(false);
    // pulmonary hypertension raises the mean target to 95 % (Starship guideline)
    expect(byCode({ ...ready, pulmonaryHypertension: true, study: { ...ready.study!, meanSpo2: 94.9 } }).study_on_target.met).toBe(false);
  });

  it('when a low-SpO2 or overdue flag is open, then the flag rule is unmet; other flags do not block', () => {
    expect(byCode({ ...ready, flags: ['below_target'] }).no_open_flags).toMatchObject({ met: false, message: 'Open flag: below SpO2 target.' });
    expect(byCode({ ...ready, flags: ['check_overdue', 'below_target'] }).no_open_flags.message).toBe('Open flag: a check is overdue, below SpO2 target.');
    expect(byCode({ ...ready, flags: ['growth_drift'] }).no_open_flags.met).toBe(true);
  });

  it('when recent readings are missing, low on average, or one is ≤ 90 %, then the readings rule is unmet', () => {
    expect(byCode({ ...ready, readings: [] }).readings_in_range).toMatchObject({ met: false, message: 'No spot reading in the last 7 days.' });
    expect(byCode({ ...ready, readings: [{ takenAt: daysAgo(8), spo2: 97 }] }).readings_in_range.met).toBe(false);
    // NHS GGC: mean ≥ 93 %; 93 exactly meets it
    expect(byCode({ ...ready, readings: [{ takenAt: daysAgo(1), spo2: 93 }] }).readings_in_range.met).toBe(true);
    expect(byCode({ ...ready, readings: [{ takenAt: daysAgo(1), spo2: 92 }, { takenAt: daysAgo(2), spo2: 93 }] }).readings_in_range.met).toBe(false);
    // ATS 2019: a reading ≤ 90 % is low under 1 year, even when the mean is fine
    const oneLow = byCode({ ...ready, readings: [{ takenAt: daysAgo(1), spo2: 99 }, { takenAt: daysAgo(1), spo2: 99 }, { takenAt: daysAgo(2), spo2: 90 }] });
    expect(oneLow.readings_in_range).toMatchObject({ met: false, message: '3 readings in the last 7 days, mean SpO2 96 % (at least 93 % needed); 1 at or below 90 %.' });
    expect(byCode({ ...ready, readings: [{ takenAt: daysAgo(1), spo2: 91 }, { takenAt: daysAgo(1), spo2: 99 }] }).readings_in_range.met).toBe(true);
    // a reading stamped in the future is not counted
    expect(byCode({ ...ready, readings: [{ takenAt: new Date(NOW.getTime() + 60_000), spo2: 97 }] }).readings_in_range.met).toBe(false);
  });

  it('when the weight has fallen below the weight at approval, then growth is unmet (common practice)', () => {
    expect(byCode({ ...ready, latestWeightKg: 3.0 }).weight_not_falling).toMatchObject({ met: false, message: 'Weight has fallen to 3 kg from 3.1 kg when the setting was approved.' });
    expect(byCode({ ...ready, latestWeightKg: 3.1 }).weight_not_falling.met).toBe(true);
    expect(byCode({ ...ready, approvedWeightKg: null }).weight_not_falling.met).toBe(true);
  });

  it('when the programme changes its windows and targets, then the rules follow the policy, not the defaults', () => {
    const strict: PolicySettings = {
      ...P,
      stepDown: { ...P.stepDown, minDaysBetweenStepDowns: 30, studyWithinDays: 1, readingsWithinDays: 2 },
      spo2Targets: { ...P.spo2Targets, spotMeanMin: 96, spotLowMax: 93 },
      oximetry: { ...P.oximetry, minValidMinutes: 600 },
    };
    const c = byCode(ready, strict);
    expect(c.time_on_setting.met).toBe(false);
    expect(c.study_judged.met).toBe(false);
    expect(byCode({ ...ready, study: { ...ready.study!, recordedAt: daysAgo(0.5) } }, strict).study_judged.message).toMatch(/less than the 10 h needed/);
    expect(c.readings_in_range.message).toBe('1 reading in the last 2 days, mean SpO2 95 % (at least 96 % needed).');
  });

  it('when a stored proposal is read back, then only the rules recorded as not met are counted; other proposals have none', () => {
    // the consultant's queue and decision read the evidence stored with the proposal (docs/product-rules.md "Stepping down")
    const checks = checkStepDownRules({ ...ready, readings: [] }, P);
    expect(unmetInEvidence({ checks }).map((c) => c.code)).toEqual(['readings_in_range']);
    expect(unmetInEvidence({ recordingId: 'r1', targetMet: true })).toEqual([]);
    expect(unmetInEvidence(null)).toEqual([]);
    expect(unmetInEvidence(undefined)).toEqual([]);
  });
});
