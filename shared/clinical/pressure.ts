import { feetToMetres, paToMmHg } from './units';

export type PressureModel = 'isa-1976' | 'west-1996';
export type PressureSource = { elevationM: number } | { elevationFt: number } | { pressureMmHg: number };

export interface ResolvedPressure {
  pressureMmHg: number;
  model: PressureModel | 'measured';
  /** Geometric elevation as entered (converted from feet if needed); null for a measured pressure. */
  elevationM: number | null;
  /** Geopotential height used by the ISA formula; null for West 1996 and for a measured pressure. */
  geopotentialM: number | null;
}

// U.S. Standard Atmosphere 1976 base constants (docs/clinical-sources.md §1.1). R* is the USSA-1976 value, deliberately
// not the current CODATA gas constant, so our figures match the published tables.
export const USSA_1976 = {
  seaLevelPressurePa: 101325,
  seaLevelTemperatureK: 288.15,
  lapseRateKPerM: 0.0065,
  g0MPerS2: 9.80665,
  molarMassKgPerMol: 0.0289644,
  gasConstantJPerMolK: 8.31432,
  earthRadiusM: 6356766,
  tropopauseGeopotentialM: 11000,
} as const;

export const ISA_EXPONENT =
  (USSA_1976.g0MPerS2 * USSA_1976.molarMassKgPerMol) / (USSA_1976.gasConstantJPerMolK * USSA_1976.lapseRateKPerM);

export const PRESSURE_MODEL_LABELS: Record<PressureModel | 'measured', { name: string; version: string }> = {
  'isa-1976': { name: 'International Standard Atmosphere, troposphere', version: 'U.S. Standard Atmosphere 1976' },
  'west-1996': { name: 'West model atmosphere', version: 'West, J Appl Physiol 1996' },
  measured: { name: 'Measured local pressure', version: 'as entered' },
};

// Below −2 km there is no inhabited land (the lowest shore, the Dead Sea, lies near −430 m, from memory), and the
// troposphere formula stops at the 11 km geopotential tropopause; refusing outside that keeps a typo from becoming
// a plausible-looking pressure.
const LOWEST_ELEVATION_M = -2000;

function assertElevationInRange(elevationM: number): void {
  if (!Number.isFinite(elevationM) || elevationM < LOWEST_ELEVATION_M) {
    throw new RangeError(`Elevation ${elevationM} m is outside the supported range`);
  }
}

/** Map elevations are geometric; the ISA formula wants geopotential height H = r0·Z/(r0 + Z). */
export function geopotentialFromGeometricM(elevationM: number): number {
  return (USSA_1976.earthRadiusM * elevationM) / (USSA_1976.earthRadiusM + elevationM);
}

export function isaPressurePaAtGeopotentialM(geopotentialM: number): number {
  if (!Number.isFinite(geopotentialM) || geopotentialM > USSA_1976.tropopauseGeopotentialM) {
    throw new RangeError(`Geopotential height ${geopotentialM} m is outside the ISA troposphere`);
  }
  const ratio = 1 - (USSA_1976.lapseRateKPerM * geopotentialM) / USSA_1976.seaLevelTemperatureK;
  return USSA_1976.seaLevelPressurePa * ratio ** ISA_EXPONENT;
}

export function isaPressureMmHg(elevationM: number): number {
  assertElevationInRange(elevationM);
  return paToMmHg(isaPressurePaAtGeopotentialM(geopotentialFromGeometricM(elevationM)));
}

/** West 1996: PB (Torr) = exp(6.63268 − 0.1112·h − 0.00149·h²), h in km; fitted to low-latitude mountains. */
export function westPressureMmHg(elevationM: number): number {
  assertElevationInRange(elevationM);
  const elevationKm = elevationM / 1000;
  return Math.exp(6.63268 - 0.1112 * elevationKm - 0.00149 * elevationKm * elevationKm);
}

export function pressureMmHgForElevation(elevationM: number, model: PressureModel): number {
  return model === 'west-1996' ? westPressureMmHg(elevationM) : isaPressureMmHg(elevationM);
}

/** A measured local pressure always wins over a model: it already includes the weather and the site. */
export function resolvePressure(source: PressureSource, model: PressureModel = 'isa-1976'): ResolvedPressure {
  if ('pressureMmHg' in source) {
    if (!Number.isFinite(source.pressureMmHg) || source.pressureMmHg <= 0) {
      throw new RangeError(`Pressure ${source.pressureMmHg} mmHg is not a usable measurement`);
    }
    return { pressureMmHg: source.pressureMmHg, model: 'measured', elevationM: null, geopotentialM: null };
  }
  const elevationM = 'elevationM' in source ? source.elevationM : feetToMetres(source.elevationFt);
  return {
    pressureMmHg: pressureMmHgForElevation(elevationM, model),
    model,
    elevationM,
    geopotentialM: model === 'isa-1976' ? geopotentialFromGeometricM(elevationM) : null,
  };
}
