// mmHg is defined through the standard atmosphere: 760 mmHg = 101325 Pa exactly (so mmHg and Torr coincide
// to the precision we show), which keeps a sea-level check at exactly 760.00.
export const PA_PER_MMHG = 101325 / 760;

// The international foot is defined as exactly 0.3048 m (1959 agreement), so 8000 ft is exactly 2438.4 m.
export const METRES_PER_FOOT = 0.3048;

// 1 psi = 1 lbf/in² = 0.45359237 kg × 9.80665 m/s² ÷ (0.0254 m)²; all three factors are exact definitions.
export const PA_PER_PSI = (0.45359237 * 9.80665) / (0.0254 * 0.0254);

export const PA_PER_BAR = 100_000;

export function mmHgToPa(pressureMmHg: number): number {
  return pressureMmHg * PA_PER_MMHG;
}

export function paToMmHg(pressurePa: number): number {
  return pressurePa / PA_PER_MMHG;
}

export function mmHgToKPa(pressureMmHg: number): number {
  return mmHgToPa(pressureMmHg) / 1000;
}

export function kPaToMmHg(pressureKPa: number): number {
  return paToMmHg(pressureKPa * 1000);
}

export function mmHgToHPa(pressureMmHg: number): number {
  return mmHgToPa(pressureMmHg) / 100;
}

export function hPaToMmHg(pressureHPa: number): number {
  return paToMmHg(pressureHPa * 100);
}

export function mmHgToPsi(pressureMmHg: number): number {
  return mmHgToPa(pressureMmHg) / PA_PER_PSI;
}

export function feetToMetres(lengthFt: number): number {
  return lengthFt * METRES_PER_FOOT;
}

export function metresToFeet(lengthM: number): number {
  return lengthM / METRES_PER_FOOT;
}

/** Minutes as hours to one decimal, for sentences such as "1.5 h of valid recording". */
export function hoursOneDecimal(minutes: number): number {
  return Math.round((minutes / 60) * 10) / 10;
}
