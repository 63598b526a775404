import { CANNULA_MODEL, flowForEffectiveFio2 } from './cannula';
import { addHospitalLines, addTargetLines, type HospitalFigures } from './conversion-hospital';
import { addHomeFlowLines, type HomeFlows } from './conversion-home';
import { addPressureLines } from './conversion-lines';
import {
  CONVERSION_VERSION,
  type PrescriptionConversion,
  type PrescriptionConversionInput,
} from './conversion-types';
import { collectConversionWarnings, type ConversionWarning, type WarningFacts } from './conversion-warnings';
import { DEFAULT_CANNULA_MAX_FLOW_LPM, DEFAULT_FLOWMETER_STEPS_LPM, assertValidSteps } from './flowmeter';
import { WATER_VAPOUR_37C_MMHG } from './oxygen';
import { PRESSURE_MODEL_LABELS, resolvePressure, type ResolvedPressure } from './pressure';
import { WorkingSheet } from './working';

type Settings = ReturnType<typeof settings>;

function settings(input: PrescriptionConversionInput) {
  const stepsLpm = input.flowmeterStepsLpm ?? DEFAULT_FLOWMETER_STEPS_LPM;
  assertValidSteps(stepsLpm);
  const cannulaMaxFlowLpm = input.cannulaMaxFlowLpm ?? DEFAULT_CANNULA_MAX_FLOW_LPM;
  if (!(cannulaMaxFlowLpm > 0)) throw new RangeError('The cannula limit must be above 0 L/min');
  return {
    stepsLpm,
    cannulaMaxFlowLpm,
    waterVapourMmHg: input.waterVapourMmHg ?? WATER_VAPOUR_37C_MMHG,
    pressureModel: input.pressureModel ?? 'isa-1976',
  };
}

interface Parts {
  hospitalPb: ResolvedPressure;
  homePb: ResolvedPressure;
  hospital: HospitalFigures;
  targetFio2: number;
  flows: HomeFlows;
  cannulaMaxFlowLpm: number;
}

function assemble(parts: Parts, settings: Settings, warnings: ConversionWarning[], sheet: WorkingSheet) {
  const { hospitalPb, homePb, hospital, flows } = parts;
  // Above the cannula limit the number is not a low-flow cannula setting any more, so no flow is proposed.
  const feasible = flows.roundedFlowLpm !== null && flows.roundedFlowLpm <= parts.cannulaMaxFlowLpm;
  const result: PrescriptionConversion = {
    hospital: {
      pressureMmHg: hospitalPb.pressureMmHg,
      pio2MmHg: hospital.pio2MmHg,
      effectiveFio2: hospital.effectiveFio2,
    },
    home: {
      pressureMmHg: homePb.pressureMmHg,
      pio2MmHg: hospital.pio2MmHg,
      targetFio2: parts.targetFio2,
      requiredFlowLpm: feasible ? flows.requiredFlowLpm : null,
      roundedFlowLpm: feasible ? flows.roundedFlowLpm : null,
      deliveredFio2: feasible ? flows.deliveredFio2 : null,
    },
    feasible,
    warnings,
    working: sheet.toArray(),
    model: {
      pressure: { ...PRESSURE_MODEL_LABELS[settings.pressureModel] },
      cannula: { ...CANNULA_MODEL },
      equivalence: 'wet PIO2-constant',
      waterVapourMmHg: settings.waterVapourMmHg,
      version: CONVERSION_VERSION,
    },
  };
  return result;
}

function warningFacts(
  input: PrescriptionConversionInput,
  config: Settings,
  parts: Parts,
  modelFlowLpm: number | null,
): WarningFacts {
  return {
    weightKg: input.weightKg,
    hospitalFlowLpm: input.flowLpm,
    sourceFraction: parts.hospital.sourceFraction,
    homeSourceFraction: parts.hospital.homeSourceFraction,
    hospital: parts.hospitalPb,
    home: parts.homePb,
    targetFio2: parts.targetFio2,
    modelFlowLpm,
    requiredFlowLpm: parts.flows.requiredFlowLpm,
    keptHospitalFlow: parts.flows.keptHospitalFlow,
    roundedFlowLpm: parts.flows.roundedFlowLpm,
    largestStepLpm: config.stepsLpm[config.stepsLpm.length - 1],
    cannulaMaxFlowLpm: config.cannulaMaxFlowLpm,
  };
}

/**
 * Converts a hospital cannula prescription into a home proposal by keeping PIO2 constant and inverting the cannula
 * model. It only computes: the result is a proposal until a consultant approves it.
 */
// Weight, flow and both supply purities are checked once, where they are used (cannula.ts); the API checks the
// request before that with the zod contract (shared/schemas/conversions.ts).
export function convertPrescription(input: PrescriptionConversionInput): PrescriptionConversion {
  const config = settings(input);
  const sheet = new WorkingSheet();
  const hospitalPb = resolvePressure(input.hospital, config.pressureModel);
  const homePb = resolvePressure(input.home, config.pressureModel);
  addPressureLines(sheet, 'hospital', hospitalPb);
  addPressureLines(sheet, 'home', homePb);
  const hospital = addHospitalLines(sheet, input, hospitalPb, config.waterVapourMmHg);
  const targetFio2 = addTargetLines(sheet, hospital, hospitalPb, homePb, config.waterVapourMmHg);
  const inverse = flowForEffectiveFio2(targetFio2, input.weightKg, hospital.homeSourceFraction);
  const flows = addHomeFlowLines(sheet, {
    weightKg: input.weightKg,
    hospitalFlowLpm: input.flowLpm,
    sourceFraction: hospital.homeSourceFraction,
    inverse,
    // The same flow gives no more oxygen at home only if neither the air nor the supply is richer there.
    homeNotRicher:
      homePb.pressureMmHg <= hospitalPb.pressureMmHg && hospital.homeSourceFraction <= hospital.sourceFraction,
    stepsLpm: config.stepsLpm,
    homePressureMmHg: homePb.pressureMmHg,
    waterVapourMmHg: config.waterVapourMmHg,
  });
  const parts = { hospitalPb, homePb, hospital, targetFio2, flows, cannulaMaxFlowLpm: config.cannulaMaxFlowLpm };
  const warnings = collectConversionWarnings(warningFacts(input, config, parts, inverse.flowLpm));
  return assemble(parts, config, warnings, sheet);
}
