import type { PolicySettings } from '../schemas/policy';
import { FLOW_TOLERANCE_LPM } from '../clinical/flowmeter';
import { hoursOneDecimal } from '../clinical/units';

export interface Setting {
  flowLpm: number;
  periods: { awake: number; asleep: number; feeding: number } | null;
}

export type NextStep =
  | { kind: 'lower'; setting: Setting; label: string }
  | { kind: 'sleep_only'; setting: Setting; label: string }
  | { kind: 'off'; setting: Setting; label: string };

const isSleepOnly = (s: Setting) => !!s.periods && s.periods.awake === 0 && s.periods.feeding === 0 && s.periods.asleep > 0;

/**
 * The next rung of the programme's step-down ladder (common practice, set in policy): lower the flow by the
 * policy's number of flowmeter steps; once at or below the night-only threshold, oxygen only while asleep; then off.
 */
export function nextStepDown(current: Setting, policy: PolicySettings): NextStep {
  const steps = policy.flowmeterStepsLpm;
  const { stepsPerDecrease, sleepOnlyBelowLpm } = policy.stepDown;
  if (isSleepOnly(current) || current.flowLpm <= FLOW_TOLERANCE_LPM) {
    return { kind: 'off', setting: { flowLpm: 0, periods: null }, label: 'Off oxygen' };
  }
  if (current.flowLpm <= sleepOnlyBelowLpm + FLOW_TOLERANCE_LPM) {
    return {
      kind: 'sleep_only',
      setting: { flowLpm: current.flowLpm, periods: { awake: 0, asleep: current.flowLpm, feeding: 0 } },
      label: `${current.flowLpm} L/min while asleep only`,
    };
  }
  const index = steps.findIndex((s) => s >= current.flowLpm - FLOW_TOLERANCE_LPM);
  const from = index < 0 ? steps.length : index;
  const target = steps[Math.max(0, from - stepsPerDecrease)];
  if (target >= current.flowLpm - FLOW_TOLERANCE_LPM) {
    return { kind: 'sleep_only', setting: { flowLpm: current.flowLpm, periods: { awake: 0, asleep: current.flowLpm, feeding: 0 } }, label: `${current.flowLpm} L/min while asleep only` };
  }
  return { kind: 'lower', setting: { flowLpm: target, periods: null }, label: `${target} L/min day and night` };
}

export interface StudyResult {
  meanSpo2: number | null;
  pctBelow90: number | null;
  validMinutes: number;
}

/**
 * Overnight target: mean SpO2 at or above the programme minimum (≥ 95 % with pulmonary hypertension) and under the
 * allowed share of valid time below 90 % (TSANZ 2020; BTS 2009 — docs/clinical-sources.md §4). A study too short to
 * judge (below the policy's minimum valid time; default 5 h after Urschitz 2003, §5.1) meets nothing and is
 * reported as not judged, never as below target.
 */
export function isJudged(validMinutes: number, policy: PolicySettings): boolean {
  return validMinutes >= policy.oximetry.minValidMinutes;
}

export function meetsOvernightTarget(study: StudyResult, policy: PolicySettings, pulmonaryHypertension: boolean): { met: boolean; judged: boolean; reasons: string[] } {
  if (!isJudged(study.validMinutes, policy)) {
    const hours = hoursOneDecimal(policy.oximetry.minValidMinutes);
    return { met: false, judged: false, reasons: [`too short to judge: less than ${hours} hours of valid recording`] };
  }
  const t = policy.spo2Targets;
  const meanMin = pulmonaryHypertension ? t.pulmonaryHypertensionMeanMin : t.overnightMeanMin;
  const reasons: string[] = [];
  if (study.meanSpo2 === null || study.meanSpo2 < meanMin) reasons.push(`mean SpO2 below ${meanMin} %`);
  if (study.pctBelow90 === null || study.pctBelow90 >= t.pctBelow90Max) reasons.push(`${t.pctBelow90Max} % or more of the time below 90 %`);
  return { met: reasons.length === 0, judged: true, reasons };
}
