import { cannulaFactor, effectiveFio2, type FlowForTarget } from './cannula';
import { PIO2_SOURCE, STOP_ROP_SOURCE } from './conversion-hospital';
import { FLOW_TOLERANCE_LPM, roundUpToStepLpm } from './flowmeter';
import { inspiredPo2MmHg } from './oxygen';
import type { WorkingSheet } from './working';

export interface HomeFlowFacts {
  weightKg: number;
  hospitalFlowLpm: number;
  /** Home supply purity. */
  sourceFraction: number;
  inverse: FlowForTarget;
  /** True when neither home air nor the home supply is richer than at the hospital. */
  homeNotRicher: boolean;
  stepsLpm: readonly number[];
  homePressureMmHg: number;
  waterVapourMmHg: number;
}

export interface HomeFlows {
  requiredFlowLpm: number | null;
  keptHospitalFlow: boolean;
  roundedFlowLpm: number | null;
  deliveredFio2: number | null;
}

/**
 * Where neither home air nor the home supply is richer, the proposal never goes below the hospital flow. The model
 * alone would lower a flow that is at or above the weight in kg (all such flows give the same factor), which would
 * be a dose cut that no pressure change justifies.
 */
function requiredFlow(sheet: WorkingSheet, facts: HomeFlowFacts): { flowLpm: number | null; kept: boolean } {
  const modelFlowLpm = facts.inverse.flowLpm;
  sheet.add({
    key: 'home.requiredFactor',
    label: 'Home cannula factor needed',
    value: facts.inverse.factor,
    unit: 'fraction',
    formula: '(target FiO2 − 0.21) ÷ (home supply fraction − 0.21); none when target > supply',
    source: STOP_ROP_SOURCE,
  });
  const floorLpm = facts.homeNotRicher ? facts.hospitalFlowLpm : 0;
  const flowLpm = modelFlowLpm === null ? null : Math.max(modelFlowLpm, floorLpm);
  // Only a real difference is reported; at equal pressures float noise alone makes the model flow a hair lower.
  const kept = modelFlowLpm !== null && floorLpm > modelFlowLpm + FLOW_TOLERANCE_LPM;
  sheet.add({
    key: 'home.requiredFlowLpm',
    label: 'Home flow needed',
    value: flowLpm,
    unit: 'L/min',
    formula: facts.homeNotRicher ? 'max(factor × weight kg, hospital flow)' : 'factor × weight kg',
    source: STOP_ROP_SOURCE,
  });
  return { flowLpm, kept };
}

function addDeliveredLines(sheet: WorkingSheet, facts: HomeFlowFacts, roundedFlowLpm: number | null): number | null {
  const delivered =
    roundedFlowLpm === null ? null : effectiveFio2(roundedFlowLpm, facts.weightKg, facts.sourceFraction);
  sheet.add({
    key: 'home.deliveredFactor',
    label: 'Home cannula factor at the rounded flow',
    value: roundedFlowLpm === null ? null : cannulaFactor(roundedFlowLpm, facts.weightKg),
    unit: 'fraction',
    formula: 'min(1, rounded flow ÷ weight kg)',
    source: STOP_ROP_SOURCE,
  });
  sheet.add({
    key: 'home.deliveredFio2',
    label: 'Home effective FiO2 delivered',
    value: delivered,
    unit: 'fraction',
    formula: '0.21 + factor × (home supply fraction − 0.21)',
    source: STOP_ROP_SOURCE,
  });
  sheet.add({
    key: 'home.deliveredPio2MmHg',
    label: 'Home inspired PO2 delivered',
    value: delivered === null ? null : inspiredPo2MmHg(delivered, facts.homePressureMmHg, facts.waterVapourMmHg),
    unit: 'mmHg',
    formula: `delivered FiO2 × (PB home − ${facts.waterVapourMmHg})`,
    source: PIO2_SOURCE,
  });
  return delivered;
}

export function addHomeFlowLines(sheet: WorkingSheet, facts: HomeFlowFacts): HomeFlows {
  const required = requiredFlow(sheet, facts);
  const roundedFlowLpm = required.flowLpm === null ? null : roundUpToStepLpm(required.flowLpm, facts.stepsLpm);
  sheet.add({
    key: 'home.roundedFlowLpm',
    label: 'Home flow, rounded up to a flowmeter step',
    value: roundedFlowLpm,
    unit: 'L/min',
    formula: 'smallest flowmeter step ≥ flow needed; none above the largest step',
    source: 'programme flowmeter steps',
  });
  const deliveredFio2 = addDeliveredLines(sheet, facts, roundedFlowLpm);
  return { requiredFlowLpm: required.flowLpm, keptHospitalFlow: required.kept, roundedFlowLpm, deliveredFio2 };
}
