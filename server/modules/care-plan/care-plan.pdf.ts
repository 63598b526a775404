import {
  CARE_PLAN_CAUTIONS, OXYGEN_SAFETY_POINTS, WARNING_SIGNS_INTRO, warningSigns, emergencyCallText, flowInWords, flowText, hoursText,
  periodLines, spo2TargetText,
} from '@shared/family/care-text';
import { dateInWords } from '@shared/dates/date-words';
import { asksForNoOxygen } from '@shared/equipment/concentrator-fit';
import { JOURNEY_MODE_LABELS, type JourneyCylinderPlan, type JourneyMode, type JourneyPeriod } from '@shared/schemas/journeys';
import { ALERT, openTaggedDocument, type PlanWriter } from './care-plan-writer';

export interface CarePlanData {
  programmeName: string;
  hospitalName: string;
  /** Calendar dates are "YYYY-MM-DD" in the family's zone; they are written in words here. */
  printedOn: string;
  baby: { name: string; birthDate: string };
  home: { elevationM: number | null; pressureMmHg: number; measured: boolean };
  setting: {
    periods: Array<{ period: JourneyPeriod; flowLpm: number }>;
    source: string;
    o2Percent: number;
    approvedBy: string;
    approvedOn: string | null;
  };
  spo2Target: { meanMin: number; lowAtOrBelow: number };
  phones: Array<{ label: string; number: string; when: string }>;
  emergencyNumber: string;
  family: Array<{ name: string; relation: string }>;
  journey: {
    destinationName: string; mode: JourneyMode; departOn: string; returnOn: string; hoursAway: number;
    periods: Array<{ period: JourneyPeriod; flowLpm: number | null }>; cylinders: JourneyCylinderPlan[]; cautions: string[];
  } | null;
}

const flowLine = (flowLpm: number) => (flowLpm === 0 ? 'off (no oxygen)' : `${flowText(flowLpm)}: ${flowInWords(flowLpm)}`);

/** The last step down: no oxygen at any part of the day. */
const noOxygen = (d: CarePlanData) => asksForNoOxygen(null, Object.fromEntries(d.setting.periods.map((p) => [p.period, p.flowLpm])));

function settingSection(w: PlanWriter, d: CarePlanData, off: boolean) {
  const s = d.setting;
  w.section('Your baby’s oxygen', () => {
    if (off) {
      // The last step down: nothing flows, so there is no flowmeter setting and no supply to name.
      w.para('No oxygen, day and night: the flowmeter stays off.', true);
    } else {
      for (const line of periodLines(s.periods)) w.para(`${line.label}: ${flowLine(line.flowLpm)}`, true);
      w.para(`Given from the home ${s.source === 'concentrator' ? 'concentrator' : 'cylinder'} (${s.o2Percent}% oxygen), through a nasal cannula.`);
    }
    w.para(d.home.measured || d.home.elevationM === null
      ? `Home air pressure (measured): ${Math.round(d.home.pressureMmHg)} mmHg.`
      : `Home: ${Math.round(d.home.elevationM).toLocaleString('en-GB')} m above sea level (air pressure about ${Math.round(d.home.pressureMmHg)} mmHg).`);
    w.para(spo2TargetText(d.spo2Target, !off));
    if (s.approvedBy) w.para(`Approved by ${s.approvedBy}${s.approvedOn ? ` on ${dateInWords(s.approvedOn)}` : ''}.`);
    w.bullets(CARE_PLAN_CAUTIONS);
  });
}

function contactsSection(w: PlanWriter, d: CarePlanData) {
  w.section('Who to call', () => {
    w.para(`Emergency: ${d.emergencyNumber}. ${emergencyCallText(d.emergencyNumber)}`, true);
    if (d.phones.length) w.bullets(d.phones.map((p) => `${p.label}: ${p.number}${p.when ? ` (${p.when})` : ''}`));
    else w.para('Your home oxygen team will give you their phone numbers.');
    w.para(`Your baby’s hospital: ${d.hospitalName}. Programme: ${d.programmeName}.`);
    if (d.family.length) w.para(`Family contacts: ${d.family.map((f) => `${f.name} (${f.relation})`).join(', ')}.`);
  });
}

function journeySection(w: PlanWriter, j: NonNullable<CarePlanData['journey']>) {
  const { doc } = w;
  // Keep the journey's heading with its settings: start it on the next page rather than strand it at the foot.
  if (doc.y > doc.page.height - doc.page.margins.bottom - 160) doc.addPage();
  w.section(`Approved journey: ${j.destinationName}`, () => {
    w.para(`${JOURNEY_MODE_LABELS[j.mode]}, ${dateInWords(j.departOn)} to ${dateInWords(j.returnOn)}, ${hoursText(j.hoursAway)} away from the home supply.`);
    // Say where these flows apply, so nobody sets the trip's flow at home.
    const where = j.mode === 'flight' ? 'on the flight' : `while away at ${j.destinationName}`;
    w.para(`Only for the trip (${where}); at home keep to your usual setting above.`);
    for (const line of periodLines(j.periods)) {
      w.para(`${line.label} ${where}: ${line.flowLpm === null ? 'ask your team (more than the cannula can give)' : flowLine(line.flowLpm)}`, true);
    }
    const take = j.cylinders.filter((c) => c.count !== null).map((c) => `${c.name}: take ${c.count}`);
    if (take.length) w.para(`Cylinders (any one of these): ${take.join('; ')}.`);
    w.bullets(j.cautions);
  });
}

/** One or two A4 pages; the text comes from the shared family wording so the page and the print agree. */
export function renderCarePlanPdf(d: CarePlanData): Promise<Buffer> {
  const { w, finish } = openTaggedDocument({ title: `Home oxygen care plan: ${d.baby.name}`, author: d.programmeName });
  w.title('Home oxygen care plan');
  w.para(`${d.baby.name}, born ${dateInWords(d.baby.birthDate)}. ${d.programmeName}. Printed ${dateInWords(d.printedOn)}: a newer plan replaces this one.`);
  const off = noOxygen(d);
  settingSection(w, d, off);
  contactsSection(w, d);
  w.section('Get help straight away', () => {
    w.para(WARNING_SIGNS_INTRO);
    w.bullets(warningSigns(!off));
  }, ALERT);
  w.section('Oxygen safety at home', () => w.bullets(OXYGEN_SAFETY_POINTS));
  if (d.journey) journeySection(w, d.journey);
  return finish();
}
