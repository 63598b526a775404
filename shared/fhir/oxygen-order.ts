import { homeFlowsOf } from '../clinical/journey-plan';
import { JOURNEY_PERIODS, type JourneyPeriod } from '../schemas/journeys';
import type { ExportSetting } from './export-input';
import { LOINC, OXYGEN_PRODUCT, SNOMED_SYSTEM, UCUM } from './codes';
import { loincConcept, quantity } from './observations';

const PERIOD_WORDS: Record<JourneyPeriod, string> = { awake: 'Awake', asleep: 'Asleep', feeding: 'Feeding' };
const SOURCE_WORDS: Record<string, string> = { cylinder: 'cylinder', concentrator: 'concentrator', blended: 'blended supply' };

/** Carried with the order wherever it goes, as on every screen that shows a setting. */
export const ORDER_CAUTIONS = [
  'Worked out by decision support and approved by a consultant; a licensed clinician decides the setting.',
  'Local protocols come first.',
  'Oxygen fire safety: no smoking or open flames near the oxygen, keep the equipment away from heat, no oil-based creams on the face.',
];

/** FiO2 as a percentage, to the four decimals the fraction is stored with (nothing dropped, nothing rounded down). */
const percentOf = (fraction: number) => Number((fraction * 100).toFixed(2));

export interface OrderParts { order: fhir4.MedicationRequest; fio2: fhir4.Observation | null }

/**
 * The approved home setting as a MedicationRequest for oxygen (intent "order"): its dose is a flow rate per period
 * of the day, which Dosage.doseAndRate.rateQuantity holds in L/min. The effective inhaled concentration worked out at
 * approval travels beside it as a calculated Observation the order cites as supporting information.
 */
export function oxygenOrder(s: ExportSetting, ctx: { subject: fhir4.Reference; system: string; fio2Url: string }): OrderParts {
  const flows = homeFlowsOf(s.flowLpm, s.periods);
  const source = SOURCE_WORDS[s.source] ?? s.source;
  const order: fhir4.MedicationRequest = {
    resourceType: 'MedicationRequest',
    identifier: [{ system: ctx.system, value: `${s.id}` }],
    status: 'active',
    intent: 'order',
    medicationCodeableConcept: { coding: [{ system: SNOMED_SYSTEM, code: OXYGEN_PRODUCT.code, display: OXYGEN_PRODUCT.display }], text: 'Oxygen' },
    subject: ctx.subject,
    dosageInstruction: JOURNEY_PERIODS.map((period, i) => ({
      sequence: i + 1,
      text: `${PERIOD_WORDS[period]}: ${flows[period]} L/min from a ${source} (${s.sourceO2Percent} % oxygen)`,
      doseAndRate: [{ rateQuantity: quantity(flows[period], UCUM.litrePerMinute) }],
    })),
    note: [{ text: `Approved setting, version ${s.version}.` }, ...ORDER_CAUTIONS.map((text) => ({ text }))],
  };
  if (s.approvedAt) order.authoredOn = s.approvedAt;
  if (s.approvedBy) order.requester = { display: s.approvedBy };
  if (s.effectiveFio2 === null) return { order, fio2: null };
  order.supportingInformation = [{ reference: ctx.fio2Url }];
  const fio2: fhir4.Observation = {
    resourceType: 'Observation', status: 'final', code: loincConcept(LOINC.inhaledO2Concentration), subject: ctx.subject,
    method: { text: 'Calculated: effective inhaled concentration for the approved flow, weight and source (see the setting’s working)' },
    valueQuantity: quantity(percentOf(s.effectiveFio2), UCUM.percent),
  };
  if (s.approvedAt) fio2.effectiveDateTime = s.approvedAt;
  return { order, fio2 };
}
