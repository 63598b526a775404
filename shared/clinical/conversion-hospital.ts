import { cannulaFactor, effectiveFio2 } from './cannula';
import type { PrescriptionConversionInput } from './conversion-types';
import { equivalentFio2, inspiredPo2MmHg } from './oxygen';
import type { ResolvedPressure } from './pressure';
import type { WorkingSheet } from './working';

export const STOP_ROP_SOURCE = 'Benaron–Benitz model as tabulated by STOP-ROP';
export const PIO2_SOURCE = 'PIO2 = FiO2 × (PB − PH2O), physiology references';

export interface HospitalFigures {
  sourceFraction: number;
  homeSourceFraction: number;
  effectiveFio2: number;
  pio2MmHg: number;
}

function addInputLines(sheet: WorkingSheet, input: PrescriptionConversionInput) {
  const sourceFraction = input.sourceO2Percent / 100;
  const homeSourceFraction = (input.homeSourceO2Percent ?? input.sourceO2Percent) / 100;
  sheet.add({
    key: 'weightKg',
    label: 'Weight',
    value: input.weightKg,
    unit: 'kg',
    formula: 'as entered',
    source: 'input',
  });
  sheet.add({
    key: 'sourceFraction',
    label: 'Hospital supply oxygen fraction',
    value: sourceFraction,
    unit: 'fraction',
    formula: 'hospital supply % ÷ 100',
    source: 'input',
  });
  sheet.add({
    key: 'homeSourceFraction',
    label: 'Home supply oxygen fraction',
    value: homeSourceFraction,
    unit: 'fraction',
    formula: 'home supply % ÷ 100 (the hospital supply when not given)',
    source: 'input',
  });
  sheet.add({
    key: 'hospital.flowLpm',
    label: 'Hospital flow',
    value: input.flowLpm,
    unit: 'L/min',
    formula: 'as entered',
    source: 'input',
  });
  return { sourceFraction, homeSourceFraction };
}

export function addHospitalLines(
  sheet: WorkingSheet,
  input: PrescriptionConversionInput,
  pressure: ResolvedPressure,
  waterVapourMmHg: number,
): HospitalFigures {
  const { sourceFraction, homeSourceFraction } = addInputLines(sheet, input);
  sheet.add({
    key: 'hospital.factor',
    label: 'Hospital cannula factor',
    value: cannulaFactor(input.flowLpm, input.weightKg),
    unit: 'fraction',
    formula: 'min(1, flow L/min ÷ weight kg)',
    source: STOP_ROP_SOURCE,
  });
  const fio2 = effectiveFio2(input.flowLpm, input.weightKg, sourceFraction);
  sheet.add({
    key: 'hospital.effectiveFio2',
    label: 'Hospital effective FiO2',
    value: fio2,
    unit: 'fraction',
    formula: '0.21 + factor × (hospital supply fraction − 0.21)',
    source: STOP_ROP_SOURCE,
  });
  const pio2MmHg = inspiredPo2MmHg(fio2, pressure.pressureMmHg, waterVapourMmHg);
  sheet.add({
    key: 'hospital.pio2MmHg',
    label: 'Hospital inspired PO2',
    value: pio2MmHg,
    unit: 'mmHg',
    formula: `effective FiO2 × (PB hospital − ${waterVapourMmHg})`,
    source: PIO2_SOURCE,
  });
  return { sourceFraction, homeSourceFraction, effectiveFio2: fio2, pio2MmHg };
}

/** The wet rule keeps PIO2 constant (docs/product-rules.md "Keep the inspired oxygen pressure"), so the home PIO2 equals the hospital's. */
export function addTargetLines(
  sheet: WorkingSheet,
  hospital: HospitalFigures,
  hospitalPb: ResolvedPressure,
  homePb: ResolvedPressure,
  waterVapourMmHg: number,
): number {
  const w = waterVapourMmHg;
  const targetFio2 = equivalentFio2(hospital.effectiveFio2, hospitalPb.pressureMmHg, homePb.pressureMmHg, 'wet', w);
  sheet.add({
    key: 'home.targetFio2',
    label: 'Home target FiO2',
    value: targetFio2,
    unit: 'fraction',
    formula: `hospital effective FiO2 × (PB hospital − ${w}) ÷ (PB home − ${w})`,
    source: 'FiO2 equivalence, wet form (PIO2 kept constant)',
  });
  sheet.add({
    key: 'home.pio2MmHg',
    label: 'Home target inspired PO2',
    value: hospital.pio2MmHg,
    unit: 'mmHg',
    formula: `target FiO2 × (PB home − ${w}), equal to the hospital PIO2`,
    source: PIO2_SOURCE,
  });
  return targetFio2;
}
