import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import {
  CARE_PLAN_CAUTIONS, OXYGEN_SAFETY_POINTS, PERIOD_LABELS, WARNING_SIGNS, WARNING_SIGNS_INTRO, emergencyCallText, flowInWords, flowText,
} from '../../../shared/family/care-text';
import { JOURNEY_MODE_LABELS, type JourneyCylinderPlan, type JourneyMode, type JourneyPeriod } from '../../../shared/schemas/journeys';

// The bundled Nunito Sans (latin subset, regular and bold); pdfkit's font reader takes WOFF as it is.
const require = createRequire(import.meta.url);
const FONT_REGULAR = require.resolve('@fontsource/nunito-sans/files/nunito-sans-latin-400-normal.woff');
const FONT_BOLD = require.resolve('@fontsource/nunito-sans/files/nunito-sans-latin-700-normal.woff');

export interface CarePlanData {
  programmeName: string;
  printedOn: string;
  baby: { name: string; birthDate: string };
  home: { elevationM: number | null; pressureMmHg: number; measured: boolean };
  setting: {
    periods: Array<{ period: JourneyPeriod; flowLpm: number }>;
    allDay: boolean;
    source: string;
    o2Percent: number;
    approvedBy: string;
    approvedOn: string | null;
  };
  phones: Array<{ label: string; number: string; when: string }>;
  emergencyNumber: string;
  family: Array<{ name: string; relation: string }>;
  journey: {
    destinationName: string; mode: JourneyMode; departOn: string; returnOn: string; hoursAway: number;
    periods: Array<{ period: JourneyPeriod; flowLpm: number | null }>; cylinders: JourneyCylinderPlan[]; cautions: string[];
  } | null;
}

const INK = '#1f2933';
const ALERT = '#9b1c1c';
const flowLine = (flowLpm: number) => (flowLpm === 0 ? 'off (no oxygen)' : `${flowText(flowLpm)}: ${flowInWords(flowLpm)}`);

function writer(doc: PDFKit.PDFDocument) {
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  return {
    heading(text: string, colour = INK) {
      doc.moveDown(0.6).font('Bold').fontSize(13).fillColor(colour).text(text, { width }).moveDown(0.2);
      doc.fillColor(INK);
    },
    para(text: string, bold = false) {
      doc.font(bold ? 'Bold' : 'Body').fontSize(10.5).text(text, { width, lineGap: 1.5 });
    },
    bullets(items: readonly string[]) {
      doc.font('Body').fontSize(10.5).list([...items], { width, bulletRadius: 1.8, textIndent: 12, lineGap: 1.5 });
    },
  };
}

function settingSection(w: ReturnType<typeof writer>, d: CarePlanData) {
  const s = d.setting;
  w.heading('Your baby’s oxygen');
  if (s.allDay) w.para(`Day and night: ${flowLine(s.periods[0].flowLpm)}`, true);
  else for (const p of s.periods) w.para(`${PERIOD_LABELS[p.period]}: ${flowLine(p.flowLpm)}`, true);
  w.para(`Given from the home ${s.source === 'concentrator' ? 'concentrator' : 'cylinder'} (${s.o2Percent}% oxygen), through a nasal cannula.`);
  w.para(d.home.measured || d.home.elevationM === null
    ? `Home air pressure (measured): ${Math.round(d.home.pressureMmHg)} mmHg.`
    : `Home: ${Math.round(d.home.elevationM).toLocaleString('en-GB')} m above sea level (air pressure about ${Math.round(d.home.pressureMmHg)} mmHg).`);
  if (s.approvedBy) w.para(`Approved by ${s.approvedBy}${s.approvedOn ? ` on ${s.approvedOn}` : ''}.`);
  w.bullets(CARE_PLAN_CAUTIONS);
}

function contactsSection(w: ReturnType<typeof writer>, d: CarePlanData) {
  w.heading('Who to call');
  w.para(`Emergency: ${d.emergencyNumber}. ${emergencyCallText(d.emergencyNumber)}`, true);
  if (d.phones.length) w.bullets(d.phones.map((p) => `${p.label}: ${p.number}${p.when ? ` (${p.when})` : ''}`));
  else w.para('Your home oxygen team will give you their phone numbers.');
  if (d.family.length) w.para(`Family contacts: ${d.family.map((f) => `${f.name} (${f.relation})`).join(', ')}.`);
}

function journeySection(doc: PDFKit.PDFDocument, w: ReturnType<typeof writer>, j: NonNullable<CarePlanData['journey']>) {
  // Keep the journey's heading with its settings: start it on the next page rather than strand it at the foot.
  if (doc.y > doc.page.height - doc.page.margins.bottom - 160) doc.addPage();
  w.heading(`Approved journey: ${j.destinationName}`);
  w.para(`${JOURNEY_MODE_LABELS[j.mode]}, ${j.departOn} to ${j.returnOn}, ${j.hoursAway} hour(s) away from the home supply.`);
  // Say where these flows apply, so nobody sets the trip's flow at home.
  const where = j.mode === 'flight' ? 'on the flight' : `while away at ${j.destinationName}`;
  w.para(`Only for the trip (${where}); at home keep to your usual setting above.`);
  for (const p of j.periods) {
    w.para(`${PERIOD_LABELS[p.period]} ${where}: ${p.flowLpm === null ? 'ask your team (more than the cannula can give)' : flowLine(p.flowLpm)}`, true);
  }
  const take = j.cylinders.filter((c) => c.count !== null).map((c) => `${c.name}: take ${c.count}`);
  if (take.length) w.para(`Cylinders (any one of these): ${take.join('; ')}.`);
  w.bullets(j.cautions);
}

/** One or two A4 pages; the text comes from the shared family wording so the page and the print agree. */
export function renderCarePlanPdf(d: CarePlanData): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 44, info: { Title: `Home oxygen care plan: ${d.baby.name}`, Author: d.programmeName, Creator: 'Nestflow' } });
  doc.registerFont('Body', FONT_REGULAR);
  doc.registerFont('Bold', FONT_BOLD);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const w = writer(doc);
  doc.font('Bold').fontSize(20).fillColor(INK).text('Home oxygen care plan');
  w.para(`${d.baby.name}, born ${d.baby.birthDate}. ${d.programmeName}. Printed ${d.printedOn}: a newer plan replaces this one.`);
  settingSection(w, d);
  contactsSection(w, d);
  w.heading('Get help straight away', ALERT);
  w.para(WARNING_SIGNS_INTRO);
  w.bullets(WARNING_SIGNS);
  w.heading('Oxygen safety at home');
  w.bullets(OXYGEN_SAFETY_POINTS);
  if (d.journey) journeySection(doc, w, d.journey);
  doc.end();
  return done;
}
