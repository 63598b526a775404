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
] as const;

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
      message: `The flow needed is above the largest flowmeter step (${lpm(facts.largestStepLpm)}).`,
    });
    return warnings;
  }
  if (facts.roundedFlowLpm > facts.cannulaMaxFlowLpm) {
    warnings.push({
      code: 'ABOVE_CANNULA_LIMIT',
      message: `The flow needed is above the ${lpm(facts.cannulaMaxFlowLpm)} low-flow cannula limit.`,
    });
  }
  return warnings;
}

function roundingWarnings(facts: WarningFacts): ConversionWarning[] {
  const { roundedFlowLpm, requiredFlowLpm } = facts;
  if (roundedFlowLpm === null || requiredFlowLpm === null) return [];
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
    ...pressureWarnings(facts),
    ...hospitalWarnings(facts),
    ...homeWarnings(facts),
    ...cappedWarnings(facts),
    ...roundingWarnings(facts),
  ];
}
