import { FLOW_TOLERANCE_LPM } from './flowmeter';
import type { ResolvedPressure } from './pressure';

export const CONVERSION_WARNING_CODES = [
  'TARGET_ABOVE_SOURCE',
  'ABOVE_LARGEST_STEP',
  'ABOVE_CANNULA_LIMIT',
  'HOSPITAL_FLOW_ABOVE_CANNULA_LIMIT',
  'HOME_AIR_BELOW_HOSPITAL_AIR',
  'HOME_AIR_ABOVE_HOSPITAL_AIR',
  'FACTOR_CAPPED',
  'KEPT_HOSPITAL_FLOW',
  'HOSPITAL_ON_ROOM_AIR',
  'ROUNDED_UP_TO_STEP',
  'MEASURED_PRESSURE_USED',
  'WEIGHT_OUTSIDE_MODEL_TABLE',
] as const;

/** The weights STOP-ROP Table 1 was tabulated for (columns 0.7 to 4 kg; docs/clinical-sources.md §3.1). */
export const CANNULA_TABLE_WEIGHT_KG = Object.freeze({ min: 0.7, max: 4 });

export type ConversionWarningCode = (typeof CONVERSION_WARNING_CODES)[number];

export interface ConversionWarning {
  code: ConversionWarningCode;
  message: string;
}

/** Everything the warnings depend on, already computed by the conversion. */
export interface WarningFacts {
  weightKg: number;
  hospitalFlowLpm: number;
  sourceFraction: number;
  homeSourceFraction: number;
  hospital: ResolvedPressure;
  home: ResolvedPressure;
  targetFio2: number;
  /** Flow from inverting the cannula model; null when the target is above the source purity. */
  modelFlowLpm: number | null;
  /** Model flow after the hospital-flow floor; null when infeasible. */
  requiredFlowLpm: number | null;
  keptHospitalFlow: boolean;
  roundedFlowLpm: number | null;
  largestStepLpm: number;
  cannulaMaxFlowLpm: number;
}

const pct = (fraction: number) => `${(fraction * 100).toFixed(1)}%`;
const lpm = (flowLpm: number) => `${Number(flowLpm.toFixed(3))} L/min`;

function pressureWarnings(facts: WarningFacts): ConversionWarning[] {
  const warnings: ConversionWarning[] = [];
  const { hospital, home } = facts;
  if (hospital.model === 'measured' || home.model === 'measured') {
    warnings.push({
      code: 'MEASURED_PRESSURE_USED',
      message: 'A measured local pressure was used instead of an elevation model; it reflects the day it was read.',
    });
  }
  if (home.pressureMmHg < hospital.pressureMmHg) {
    warnings.push({
      code: 'HOME_AIR_BELOW_HOSPITAL_AIR',
      message: 'Air pressure at home is lower than at the hospital, so the same setting gives less oxygen at home.',
    });
  } else if (home.pressureMmHg > hospital.pressureMmHg) {
    warnings.push({
      code: 'HOME_AIR_ABOVE_HOSPITAL_AIR',
      message: 'Air pressure at home is higher than at the hospital, so the proposal lowers the oxygen given.',
    });
  }
  return warnings;
}

function hospitalWarnings(facts: WarningFacts): ConversionWarning[] {
  const warnings: ConversionWarning[] = [];
  if (facts.hospitalFlowLpm === 0 || facts.sourceFraction <= 0.21) {
    warnings.push({
      code: 'HOSPITAL_ON_ROOM_AIR',
      message:
        'The hospital setting gives room air only; any home oxygen proposed comes from the pressure change alone.',
    });
  }
  if (facts.hospitalFlowLpm > facts.cannulaMaxFlowLpm) {
    warnings.push({
      code: 'HOSPITAL_FLOW_ABOVE_CANNULA_LIMIT',
      message: `The hospital flow is above the ${lpm(facts.cannulaMaxFlowLpm)} low-flow cannula limit.`,
    });
  }
  return warnings;
}

// The model cannot tell apart flows at or above the weight in kg (factor capped at 1), so a consultant must know
// when either setting sits in that flat part of the curve.
function cappedWarnings(facts: WarningFacts): ConversionWarning[] {
  const homeCapped = facts.roundedFlowLpm !== null && facts.roundedFlowLpm >= facts.weightKg;
  if (facts.hospitalFlowLpm < facts.weightKg && !homeCapped) return [];
  return [
    {
      code: 'FACTOR_CAPPED',
      message:
        'A flow is at or above the weight in kg, so the model assumes every breath is cannula gas; ' +
        'flow beyond that point makes no difference in the model.',
    },
  ];
}

function weightWarnings(facts: WarningFacts): ConversionWarning[] {
  const { min, max } = CANNULA_TABLE_WEIGHT_KG;
  if (facts.weightKg >= min && facts.weightKg <= max) return [];
  return [
    {
      code: 'WEIGHT_OUTSIDE_MODEL_TABLE',
      message:
        `The weight ${facts.weightKg} kg is outside the ${min}–${max} kg range the cannula model was tabulated for ` +
        '(STOP-ROP Table 1): check the weight, and treat the effective FiO2 as an extrapolation.',
    },
  ];
}

function homeWarnings(facts: WarningFacts): ConversionWarning[] {
  const warnings: ConversionWarning[] = [];
  if (facts.modelFlowLpm === null) {
    warnings.push({
      code: 'TARGET_ABOVE_SOURCE',
      message:
        `The home target FiO2 ${pct(facts.targetFio2)} is above the home supply purity ` +
        `${pct(facts.homeSourceFraction)}; no cannula flow can reach it.`,
    });
    return warnings;
  }
  if (facts.keptHospitalFlow) {
    warnings.push({
      code: 'KEPT_HOSPITAL_FLOW',
      message: 'Neither home air nor the home supply is richer, so the proposal does not go below the hospital flow.',
    });
  }
  if (facts.roundedFlowLpm === null) {
    warnings.push({
      code: 'ABOVE_LARGEST_STEP',
      message:
        `The flow needed (${lpm(facts.requiredFlowLpm ?? facts.modelFlowLpm)}) is above the programme's largest flowmeter step ` +
        `(${lpm(facts.largestStepLpm)})${(facts.requiredFlowLpm ?? 0) <= facts.cannulaMaxFlowLpm ? `, though within the ${lpm(facts.cannulaMaxFlowLpm)} cannula limit` : ''}.`,
    });
    return warnings;
  }
  if (facts.roundedFlowLpm > facts.cannulaMaxFlowLpm) {
    warnings.push({
      code: 'ABOVE_CANNULA_LIMIT',
      message: `The flow needed (${lpm(facts.roundedFlowLpm)} at the next flowmeter step) is above the ${lpm(facts.cannulaMaxFlowLpm)} low-flow cannula limit.`,
    });
  }
  return warnings;
}

function roundingWarnings(facts: WarningFacts): ConversionWarning[] {
  const { roundedFlowLpm, requiredFlowLpm } = facts;
  if (roundedFlowLpm === null || requiredFlowLpm === null) return [];
  // Beyond the cannula no flow is proposed, so there is nothing "rounded up to" to speak of.
  if (roundedFlowLpm > facts.cannulaMaxFlowLpm) return [];
  if (roundedFlowLpm <= requiredFlowLpm + FLOW_TOLERANCE_LPM) return [];
  return [
    {
      code: 'ROUNDED_UP_TO_STEP',
      message: `The flow was rounded up to the next flowmeter step (${lpm(roundedFlowLpm)}), never down.`,
    },
  ];
}

export function collectConversionWarnings(facts: WarningFacts): ConversionWarning[] {
  return [
    ...weightWarnings(facts),
    ...pressureWarnings(facts),
    ...hospitalWarnings(facts),
    ...homeWarnings(facts),
    ...cappedWarnings(facts),
    ...roundingWarnings(facts),
  ];
}

/** Which limit stops a proposal, in words, so the screen never blames the cannula for a flowmeter limit. */
export function infeasibleReason(warnings: readonly ConversionWarning[]): string {
  const codes = new Set(warnings.map((w) => w.code));
  if (codes.has('TARGET_ABOVE_SOURCE')) return 'No flow reaches the target at home: it is above the oxygen supply’s purity.';
  if (codes.has('ABOVE_LARGEST_STEP')) return 'The flow needed at home is above the programme’s largest flowmeter step.';
  if (codes.has('ABOVE_CANNULA_LIMIT')) return 'The flow needed at home is above the low-flow cannula limit.';
  return 'No setting on the programme’s equipment reaches the target at home.';
}
