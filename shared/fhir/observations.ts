import type { ExportReading, ExportStudy } from './export-input';
import { LOINC, LOINC_SYSTEM, NESTFLOW_OXIMETRY_SYSTEM, OBSERVATION_CATEGORY_SYSTEM, STUDY_CODES, UCUM, UCUM_SYSTEM, type UcumCode } from './codes';

type LoincTerm = (typeof LOINC)[keyof typeof LOINC];

export const quantity = (value: number, unit: UcumCode): fhir4.Quantity => ({ value, unit, system: UCUM_SYSTEM, code: unit });
export const loincConcept = (term: LoincTerm): fhir4.CodeableConcept => ({ coding: [{ system: LOINC_SYSTEM, code: term.code, display: term.display }], text: term.display });
const category = (code: 'vital-signs' | 'procedure', display: string): fhir4.CodeableConcept[] => [
  { coding: [{ system: OBSERVATION_CATEGORY_SYSTEM, code, display }] },
];
const vitalSigns = () => category('vital-signs', 'Vital Signs');

const STATE_WORDS: Record<ExportReading['state'], string> = { awake: 'awake', asleep: 'asleep', feeding: 'feeding', crying: 'crying' };

function readingNotes(r: ExportReading): fhir4.Annotation[] {
  const words = [`Taken while ${STATE_WORDS[r.state]}.`];
  if (r.familyReported) words.push('Reported by the family.');
  return [{ text: words.join(' ') }];
}

interface ReadingContext { subject: fhir4.Reference; system: string }

/**
 * One spot reading as vital-sign Observations: the SpO2 carries the oxygen flow it was taken on as a component (an
 * SpO2 is read against the flow), and the pulse and a weight, when logged, stand as Observations of their own.
 */
export function readingObservations(r: ExportReading, ctx: ReadingContext): fhir4.Observation[] {
  // A corrected reading is exported as amended, so the receiver knows the first figures were replaced.
  const status: fhir4.Observation['status'] = r.corrected ? 'amended' : 'final';
  const base = (part: string) => ({
    resourceType: 'Observation' as const, identifier: [{ system: ctx.system, value: `${r.id}/${part}` }], status, category: vitalSigns(),
    subject: ctx.subject, effectiveDateTime: r.takenAt,
  });
  const spo2: fhir4.Observation = { ...base('spo2'), code: loincConcept(LOINC.spo2PulseOximetry), valueQuantity: quantity(r.spo2, UCUM.percent), note: readingNotes(r) };
  if (r.flowLpm !== null) spo2.component = [{ code: loincConcept(LOINC.inhaledO2FlowRate), valueQuantity: quantity(r.flowLpm, UCUM.litrePerMinute) }];
  const out = [spo2];
  if (r.pulse !== null) out.push({ ...base('pulse'), code: loincConcept(LOINC.heartRate), valueQuantity: quantity(r.pulse, UCUM.perMinute) });
  if (r.weightKg !== null) out.push({ ...base('weight'), code: loincConcept(LOINC.bodyWeight), valueQuantity: quantity(r.weightKg, UCUM.kilogram) });
  return out;
}

/** The weight on the baby's record, which the approved setting was worked out for. */
export function recordWeightObservation(weightKg: number, weightDate: string, subject: fhir4.Reference): fhir4.Observation {
  return {
    resourceType: 'Observation', status: 'final', category: vitalSigns(), code: loincConcept(LOINC.bodyWeight), subject,
    effectiveDateTime: weightDate, valueQuantity: quantity(weightKg, UCUM.kilogram), note: [{ text: 'The weight on the baby’s record.' }],
  };
}

type StudyFigure = Exclude<keyof typeof STUDY_CODES, 'summary'>;
const STUDY_FIGURES: StudyFigure[] = ['validMinutes', 'meanSpo2', 'medianSpo2', 'minSpo2', 'pctBelow90', 'pctBelow92', 'pctBelow93', 'odi3', 'odi4', 'meanPulse'];

const studyConcept = (c: { code: string; display: string }): fhir4.CodeableConcept => ({ coding: [{ system: NESTFLOW_OXIMETRY_SYSTEM, code: c.code, display: c.display }], text: c.display });

/**
 * One analysed overnight study as a single Observation whose components are the night's figures: they come from
 * one recording in one analysis and mean little apart (see docs/fhir-export.md for why not a DiagnosticReport).
 */
export function studyObservation(s: ExportStudy, ctx: ReadingContext): fhir4.Observation {
  const obs: fhir4.Observation = {
    resourceType: 'Observation', identifier: [{ system: ctx.system, value: s.id }], status: 'final',
    category: category('procedure', 'Procedure'), code: studyConcept(STUDY_CODES.summary), subject: ctx.subject,
    method: { text: `Overnight pulse oximetry, analysed by Nestflow${s.analysisVersion ? ` (rules ${s.analysisVersion})` : ''}` },
    component: STUDY_FIGURES.filter((f) => s[f] !== null).map((f) => ({
      code: studyConcept(STUDY_CODES[f]), valueQuantity: quantity(s[f] as number, STUDY_CODES[f].unit),
    })),
  };
  if (s.startedAt) {
    obs.effectivePeriod = { start: s.startedAt, end: new Date(Date.parse(s.startedAt) + Math.round(s.durationSec * 1000)).toISOString() };
  }
  if (s.analysedAt) obs.issued = s.analysedAt;
  return obs;
}
