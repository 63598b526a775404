import { ISA_EXPONENT, PRESSURE_MODEL_LABELS, USSA_1976, type ResolvedPressure } from './pressure';
import type { WorkingSheet } from './working';

export type Side = 'hospital' | 'home';

const SIDE_LABEL: Record<Side, string> = { hospital: 'Hospital', home: 'Home' };

const { seaLevelPressurePa, lapseRateKPerM, seaLevelTemperatureK } = USSA_1976;
const ISA_FORMULA =
  `PB = ${seaLevelPressurePa} Pa × (1 − ${lapseRateKPerM} × H / ${seaLevelTemperatureK})` +
  `^${ISA_EXPONENT.toFixed(6)}, then × 760/101325 for mmHg`;
const WEST_FORMULA = 'PB = exp(6.63268 − 0.1112 h − 0.00149 h²), h = elevation in km';

function pressureFormula(resolved: ResolvedPressure): string {
  if (resolved.model === 'isa-1976') return ISA_FORMULA;
  if (resolved.model === 'west-1996') return WEST_FORMULA;
  return 'measured local pressure, entered directly';
}

function modelSource(resolved: ResolvedPressure): string {
  const label = PRESSURE_MODEL_LABELS[resolved.model];
  return `${label.name} (${label.version})`;
}

/** Elevation, geopotential height (ISA only) and pressure for one side, so the pressure can be redone by hand. */
export function addPressureLines(sheet: WorkingSheet, side: Side, resolved: ResolvedPressure): void {
  const label = SIDE_LABEL[side];
  if (resolved.elevationM !== null) {
    sheet.add({
      key: `${side}.elevationM`,
      label: `${label} elevation (geometric)`,
      value: resolved.elevationM,
      unit: 'm',
      formula: 'as entered (feet × 0.3048 when entered in feet)',
      source: 'input',
    });
  }
  if (resolved.geopotentialM !== null) {
    sheet.add({
      key: `${side}.geopotentialM`,
      label: `${label} geopotential height`,
      value: resolved.geopotentialM,
      unit: 'm',
      formula: `H = ${USSA_1976.earthRadiusM} × Z / (${USSA_1976.earthRadiusM} + Z)`,
      source: modelSource(resolved),
    });
  }
  sheet.add({
    key: `${side}.pressureMmHg`,
    label: `${label} barometric pressure`,
    value: resolved.pressureMmHg,
    unit: 'mmHg',
    formula: pressureFormula(resolved),
    source: modelSource(resolved),
  });
}
