import { flowInWords, flowText, periodLines } from '@shared/family/care-text';
import { LETTER_CAUTIONS, checksPlanText } from '@shared/discharge/letter-text';
import { dateInWords } from '@shared/dates/date-words';
import { DISCHARGE_GROUP_LABELS } from '@shared/schemas/discharge-policy';
import type { JourneyPeriod } from '@shared/schemas/journeys';
import { ALERT, openTaggedDocument } from '../care-plan/care-plan-writer';

export interface DischargeLetterData {
  programmeName: string;
  hospitalName: string;
  printedOn: string;
  baby: { name: string; birthDate: string; address: string };
  team: { nurse: string; consultant: string };
  dischargedOn: string | null;
  override: { reason: string; by: string } | null;
  setting: { periods: Array<{ period: JourneyPeriod; flowLpm: number }>; source: string; o2Percent: number; approvedBy: string; approvedOn: string | null };
  targets: { overnightMeanMin: number; pctBelow90Max: number; pulmonaryHypertensionMeanMin: number; spotLowMax: number; pulmonaryHypertension: boolean };
  checks: { firstCheckWithinHours: number; weeklyChecks: number; thenEveryWeeks: number };
  /** The first home visit: the one booked on or after the discharge date, else the date proposed for it. */
  firstVisit: { on: string; booked: boolean } | null;
  notDone: Array<{ group: keyof typeof DISCHARGE_GROUP_LABELS; label: string }>;
  phones: Array<{ label: string; number: string; when: string }>;
  emergencyNumber: string;
}

const flowLine = (flowLpm: number) => (flowLpm === 0 ? 'off (no oxygen)' : `${flowText(flowLpm)} (${flowInWords(flowLpm)})`);

/** A letter for the family doctor and the community team, written from the record (an approved setting only). */
export function renderDischargeLetterPdf(d: DischargeLetterData): Promise<Buffer> {
  const { w, finish } = openTaggedDocument({ title: `Discharge letter: ${d.baby.name}`, author: d.programmeName });
  w.title('Home oxygen discharge letter');
  w.para(`For the family doctor and the community team. ${d.programmeName}, ${d.hospitalName}. Written ${dateInWords(d.printedOn)}.`);
  w.para(`${d.baby.name}, born ${dateInWords(d.baby.birthDate)}. Home: ${d.baby.address}.`, true);
  w.para(`Nurse: ${d.team.nurse || 'not yet named'}. Consultant: ${d.team.consultant || 'not yet named'}.`);

  w.section('Going home', () => {
    w.para(d.dischargedOn ? `Discharge date: ${dateInWords(d.dischargedOn)}.` : 'Discharge date: not yet set.', true);
    if (d.override) w.para(`The date was set by ${d.override.by || 'a consultant'} before every step was done. Reason given: ${d.override.reason}`);
    if (d.notDone.length) {
      w.para('Steps not yet done:');
      w.bullets(d.notDone.map((n) => `${DISCHARGE_GROUP_LABELS[n.group]}: ${n.label}`));
    } else w.para('Every step of the programme’s discharge checklist is done.');
  });

  w.section('Home oxygen setting (approved)', () => {
    const s = d.setting;
    for (const line of periodLines(s.periods)) w.para(`${line.label}: ${flowLine(line.flowLpm)}`, true);
    w.para(`From a home ${s.source === 'concentrator' ? 'concentrator' : 'cylinder'} (${s.o2Percent}% oxygen) through a nasal cannula.`);
    w.para(`Approved by ${s.approvedBy || 'the consultant'}${s.approvedOn ? ` on ${dateInWords(s.approvedOn)}` : ''}.`);
    w.bullets(LETTER_CAUTIONS);
  }, ALERT);

  w.section('Oxygen saturation (SpO2) targets', () => {
    const t = d.targets;
    w.bullets([
      `Overnight: mean SpO2 ${t.pulmonaryHypertension ? t.pulmonaryHypertensionMeanMin : t.overnightMeanMin}% or more${t.pulmonaryHypertension ? ' (pulmonary hypertension)' : ''}, with no more than ${t.pctBelow90Max}% of the night below 90%.`,
      `A steady spot reading of ${t.spotLowMax}% or less is low.`,
    ]);
  });

  w.section('Follow-up plan', () => {
    const items = [
      d.firstVisit
        ? `First home visit by the nurse: ${d.firstVisit.booked ? 'booked' : 'proposed'} for ${dateInWords(d.firstVisit.on)}.`
        : 'First home visit by the nurse: proposed once the discharge date is set.',
      checksPlanText(d.checks),
      'An overnight oximetry study before each step down of the oxygen, decided by the consultant.',
    ];
    w.bullets(items);
  });

  w.section('Who to call', () => {
    if (d.phones.length) w.bullets(d.phones.map((p) => `${p.label}: ${p.number}${p.when ? ` (${p.when})` : ''}`));
    else w.para('The programme has not entered its phone numbers yet.');
    w.para(`Emergency: ${d.emergencyNumber}.`);
  });
  return finish();
}
