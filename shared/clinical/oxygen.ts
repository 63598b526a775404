// Inspired gas is fully saturated with water at body temperature; 47 mmHg is the usual 37 °C value
// (docs/clinical-sources.md §2.1, physiology references). Kept as a parameter for a programme that wants 47.1.
export const WATER_VAPOUR_37C_MMHG = 47;

// Respiratory exchange ratio on a mixed diet (physiology references, range 0.7–1.0).
export const DEFAULT_RESPIRATORY_EXCHANGE_RATIO = 0.8;

export type EquivalenceForm = 'wet' | 'dry';

export const EQUIVALENCE_LABELS: Record<EquivalenceForm, string> = {
  wet: 'wet PIO2-constant',
  dry: 'dry FiO2×PB-constant',
};

function assertDryGasPressure(pressureMmHg: number, waterVapourMmHg: number): void {
  if (!(pressureMmHg > waterVapourMmHg)) {
    throw new RangeError(`Pressure ${pressureMmHg} mmHg leaves no dry gas above ${waterVapourMmHg} mmHg of water`);
  }
}

export function inspiredPo2MmHg(fio2: number, pressureMmHg: number, waterVapourMmHg = WATER_VAPOUR_37C_MMHG): number {
  assertDryGasPressure(pressureMmHg, waterVapourMmHg);
  return fio2 * (pressureMmHg - waterVapourMmHg);
}

export interface AlveolarInput {
  fio2: number;
  pressureMmHg: number;
  paco2MmHg: number;
  respiratoryExchangeRatio?: number;
  waterVapourMmHg?: number;
}

/** Bedside form PAO2 = PIO2 − PaCO2/R; ignores the small volume change when R ≠ 1 (about 2 mmHg in air). */
export function alveolarPo2SimplifiedMmHg(input: AlveolarInput): number {
  const r = input.respiratoryExchangeRatio ?? DEFAULT_RESPIRATORY_EXCHANGE_RATIO;
  return inspiredPo2MmHg(input.fio2, input.pressureMmHg, input.waterVapourMmHg) - input.paco2MmHg / r;
}

/**
 * Full form PAO2 = PIO2 − PaCO2 × [FiO2 + (1 − FiO2)/R]. The bracket must read (1 − FiO2)/R: a misprinted copy
 * with (1 − FiO2/R) circulates (docs/clinical-sources.md §2.1), so the tests pin the published 107 mmHg sample value.
 */
export function alveolarPo2FullMmHg(input: AlveolarInput): number {
  const r = input.respiratoryExchangeRatio ?? DEFAULT_RESPIRATORY_EXCHANGE_RATIO;
  const pio2 = inspiredPo2MmHg(input.fio2, input.pressureMmHg, input.waterVapourMmHg);
  return pio2 - input.paco2MmHg * (input.fio2 + (1 - input.fio2) / r);
}

export function alveolarArterialGradientMmHg(alveolarPo2MmHg: number, arterialPo2MmHg: number): number {
  return alveolarPo2MmHg - arterialPo2MmHg;
}

/**
 * FiO2 at pressure 2 giving the same oxygen as FiO2₁ at pressure 1. The wet form keeps PIO2 constant and is the
 * product default (docs/product-rules.md "Keep the inspired oxygen pressure"); the dry form keeps FiO2×PB constant, gives a lower FiO2 at altitude, and exists
 * only so a screen can show both, labelled.
 */
export function equivalentFio2(
  fio2: number,
  fromPressureMmHg: number,
  toPressureMmHg: number,
  // Stryker disable next-line StringLiteral: any form other than 'dry' takes the wet branch, so '' behaves as 'wet'
  form: EquivalenceForm = 'wet',
  waterVapourMmHg = WATER_VAPOUR_37C_MMHG,
): number {
  if (form === 'dry') {
    if (!(toPressureMmHg > 0)) throw new RangeError('Destination pressure must be positive');
    return (fio2 * fromPressureMmHg) / toPressureMmHg;
  }
  assertDryGasPressure(fromPressureMmHg, waterVapourMmHg);
  assertDryGasPressure(toPressureMmHg, waterVapourMmHg);
  return (fio2 * (fromPressureMmHg - waterVapourMmHg)) / (toPressureMmHg - waterVapourMmHg);
}
