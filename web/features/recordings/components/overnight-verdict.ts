import { hoursOneDecimal } from '@shared/clinical/units';
import type { PolicySettings } from '@shared/schemas/policy';
import type { RecordingSummary } from '@shared/schemas/recordings';
import { meetsOvernightTarget } from '@shared/schedule/step-down';

export interface Verdict {
  met: boolean;
  /** False when the study is too short to judge: the headline says exactly that, never "below target". */
  judged: boolean;
  /** "Meets the overnight target" or "Below the overnight target: …", always in words. */
  text: string;
  /** What the target is, from the programme's policy. */
  targetText: string;
}

/** The same rule the server applies when it considers a step down, so the page and the proposal never disagree. */
export function overnightVerdict(summary: RecordingSummary, settings: PolicySettings, pulmonaryHypertension: boolean): Verdict {
  const result = meetsOvernightTarget(
    { meanSpo2: summary.meanSpo2, pctBelow90: summary.pctBelow90, validMinutes: summary.validMinutes },
    settings,
    pulmonaryHypertension,
  );
  const t = settings.spo2Targets;
  const hours = (minutes: number) => `${hoursOneDecimal(minutes)} h`;
  if (!summary.judged) {
    return {
      met: false, judged: false,
      text: `Too short to judge: ${hours(summary.validMinutes)} of valid recording, at least ${hours(summary.minValidMinutes)} needed. Repeat the study; this one does not count.`,
      targetText: 'A study this short is neither on nor below the overnight target; the planned study stays open.',
    };
  }
  const meanMin = pulmonaryHypertension ? t.pulmonaryHypertensionMeanMin : t.overnightMeanMin;
  return {
    met: result.met,
    judged: true,
    text: result.met ? 'Meets the overnight target' : `Below the overnight target: ${result.reasons.join('; ')}`,
    targetText: `Target: mean SpO2 at least ${meanMin} %${pulmonaryHypertension ? ' (pulmonary hypertension)' : ''} and less than ${t.pctBelow90Max} % of valid time below 90 %.`,
  };
}
