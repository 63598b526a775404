import type { PolicySettings } from '../schemas/policy';
import type { InfantFlag } from '../schemas/infants';
import { meetsOvernightTarget } from './step-down';
import { hoursOneDecimal } from '../clinical/units';

/**
 * The programme's rules for a step down, checked on the server before a request is accepted and shown on the
 * nurse's form before sending and on the consultant's review. Each rule and its source:
 * - time on setting: at least `stepDown.minDaysBetweenStepDowns` days since the current setting was approved
 *   (default 14; common practice, ATS 2019 describes stepwise weaning, e.g. weekly);
 * - study: the latest overnight study no older than `stepDown.studyWithinDays` (default 7; TSANZ 2020 asks for
 *   overnight oximetry when weaning; the window is common practice) and long enough to judge
 *   (`oximetry.minValidMinutes`, default 300: Urschitz 2003 excluded studies under 5 h);
 * - study on target: mean SpO2 ≥ 93 % (≥ 95 % with pulmonary hypertension) and < 5 % of valid time below 90 %
 *   (BTS 2009, TSANZ 2020);
 * - flags: no open "below SpO2 target" or "check overdue" flag (the programme's own safety rule);
 * - spot readings: at least one in the last `stepDown.readingsWithinDays` days (default 7), their mean ≥ 93 % (NHS
 *   GGC neonatal home-oxygen guideline) and none ≤ 90 % (ATS 2019 hypoxaemia definition under 1 year);
 * - growth: the latest weight is not below the weight the current setting was approved at (common practice:
 *   eTG and NHS GGC name weight gain among the signs of readiness; a baby losing weight is not weaned).
 */
export const STEP_DOWN_RULE_CODES = ['time_on_setting', 'study_judged', 'study_on_target', 'no_open_flags', 'readings_in_range', 'weight_not_falling'] as const;
export type StepDownRuleCode = (typeof STEP_DOWN_RULE_CODES)[number];

export interface RuleCheck {
  code: StepDownRuleCode;
  met: boolean;
  message: string;
}

export interface StudyFacts {
  recordedAt: Date;
  validMinutes: number;
  meanSpo2: number | null;
  pctBelow90: number | null;
}

export interface StepDownFacts {
  now: Date;
  /** When the current setting was approved; null when no approved setting exists. */
  settingApprovedAt: Date | null;
  approvedWeightKg: number | null;
  latestWeightKg: number;
  pulmonaryHypertension: boolean;
  flags: readonly InfantFlag[];
  study: StudyFacts | null;
  readings: readonly { takenAt: Date; spo2: number }[];
}

const DAY_MS = 86_400_000;
const BLOCKING_FLAGS: Partial<Record<InfantFlag, string>> = { below_target: 'below SpO2 target', check_overdue: 'a check is overdue' };
const days = (n: number) => `${n} day${n === 1 ? '' : 's'}`;
const oneDecimal = (n: number) => (Math.round(n * 10) / 10).toString();

function timeOnSetting(f: StepDownFacts, p: PolicySettings): RuleCheck {
  const need = p.stepDown.minDaysBetweenStepDowns;
  if (!f.settingApprovedAt) return { code: 'time_on_setting', met: false, message: 'There is no approved setting to step down from.' };
  const onFor = Math.floor((f.now.getTime() - f.settingApprovedAt.getTime()) / DAY_MS);
  return { code: 'time_on_setting', met: onFor >= need, message: `On the current setting for ${days(Math.max(0, onFor))}; the programme asks for at least ${days(need)}.` };
}

function studyChecks(f: StepDownFacts, p: PolicySettings): RuleCheck[] {
  const within = p.stepDown.studyWithinDays;
  const s = f.study;
  const fresh = s !== null && f.now.getTime() - s.recordedAt.getTime() <= within * DAY_MS;
  if (!s || !fresh) {
    const why = s ? `The latest overnight study is older than ${days(within)}.` : 'No overnight study has been analysed.';
    return [
      { code: 'study_judged', met: false, message: `${why} A study from the last ${days(within)} is needed.` },
      { code: 'study_on_target', met: false, message: 'No recent study to compare with the overnight target.' },
    ];
  }
  const min = p.oximetry.minValidMinutes;
  if (s.validMinutes < min) {
    return [
      { code: 'study_judged', met: false, message: `The latest study has ${hoursOneDecimal(s.validMinutes)} h of valid recording, less than the ${hoursOneDecimal(min)} h needed to judge it: repeat the study.` },
      { code: 'study_on_target', met: false, message: 'A study too short to judge does not count for or against the target.' },
    ];
  }
  const target = meetsOvernightTarget(s, p, f.pulmonaryHypertension);
  return [
    { code: 'study_judged', met: true, message: `A study from the last ${days(within)} with ${hoursOneDecimal(s.validMinutes)} h of valid recording.` },
    { code: 'study_on_target', met: target.met, message: target.met ? 'The latest study meets the overnight target.' : `The latest study is below the overnight target: ${target.reasons.join('; ')}.` },
  ];
}

function flagCheck(f: StepDownFacts): RuleCheck {
  const open = f.flags.flatMap((flag) => (BLOCKING_FLAGS[flag] ? [BLOCKING_FLAGS[flag]] : []));
  return { code: 'no_open_flags', met: open.length === 0, message: open.length ? `Open flag: ${open.join(', ')}.` : 'No open low-SpO2 or overdue-check flag.' };
}

function readingsCheck(f: StepDownFacts, p: PolicySettings): RuleCheck {
  const within = p.stepDown.readingsWithinDays;
  const { spotMeanMin, spotLowMax } = p.spo2Targets;
  const recent = f.readings.filter((r) => r.takenAt.getTime() <= f.now.getTime() && f.now.getTime() - r.takenAt.getTime() <= within * DAY_MS);
  if (recent.length === 0) return { code: 'readings_in_range', met: false, message: `No spot reading in the last ${days(within)}.` };
  const mean = recent.reduce((sum, r) => sum + r.spo2, 0) / recent.length;
  const low = recent.filter((r) => r.spo2 <= spotLowMax).length;
  const parts = [`${recent.length} reading${recent.length === 1 ? '' : 's'} in the last ${days(within)}, mean SpO2 ${oneDecimal(mean)} % (at least ${spotMeanMin} % needed)`];
  if (low) parts.push(`${low} at or below ${spotLowMax} %`);
  return { code: 'readings_in_range', met: mean >= spotMeanMin && low === 0, message: `${parts.join('; ')}.` };
}

function weightCheck(f: StepDownFacts): RuleCheck {
  if (f.approvedWeightKg === null) return { code: 'weight_not_falling', met: true, message: `Latest weight ${f.latestWeightKg} kg.` };
  const met = f.latestWeightKg >= f.approvedWeightKg;
  return {
    code: 'weight_not_falling', met,
    message: met ? `Weight ${f.latestWeightKg} kg, at or above ${f.approvedWeightKg} kg when the setting was approved.` : `Weight has fallen to ${f.latestWeightKg} kg from ${f.approvedWeightKg} kg when the setting was approved.`,
  };
}

/** Every rule, in a fixed order, each met or not with a sentence that says why. */
export function checkStepDownRules(f: StepDownFacts, p: PolicySettings): RuleCheck[] {
  return [timeOnSetting(f, p), ...studyChecks(f, p), flagCheck(f), readingsCheck(f, p), weightCheck(f)];
}

export const unmetRules = (checks: readonly RuleCheck[]) => checks.filter((c) => !c.met);

/** The unmet rules recorded in a proposal's stored evidence; none for proposals that carry no rule checks. */
export function unmetInEvidence(evidence: unknown): { code: string; message: string }[] {
  const checks = (evidence as { checks?: unknown } | null | undefined)?.checks;
  return Array.isArray(checks) ? (checks as { code: string; met: boolean; message: string }[]).filter((c) => c?.met === false) : [];
}
