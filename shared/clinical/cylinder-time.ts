import { cylinderMinutesFromPsi, cylinderRemainingFraction } from './cylinders';

/** A cylinder as the programme lists it (structurally the policy's cylinder type; any pressure unit). */
export interface CylinderSpec {
  contentLitres: number;
  fullPressure: number;
  residualPressure: number;
}

export interface CylinderTimeInput {
  cylinder: CylinderSpec;
  /** The gauge reading, in the cylinder's own unit (bar or psi). */
  gauge: number;
  flowLpm: number;
  /** The programme's reserve: extra supply on top of the need, as a percentage (policy supply.reservePercent). */
  reservePercent: number;
}

export interface CylinderTime {
  /** Litres per unit of pressure: labelled contents ÷ full pressure (docs/clinical-sources.md §7). */
  factor: number;
  /** Gas left above the change-over (residual) pressure. */
  usableLitres: number;
  /** Usable share left of a full cylinder, 0–1. */
  fractionLeft: number;
  /** Time until the gauge reaches the change-over pressure; null at 0 L/min (nothing is used). */
  minutesTotal: number | null;
  /** Time before the reserve is reached, i.e. when a new cylinder should be started or fetched. */
  minutesBeforeReserve: number | null;
  /** The part of minutesTotal kept back as the reserve. */
  reserveMinutes: number | null;
  /** A reading above the full pressure is possible (warm cylinder, gauge error) but worth a second look. */
  gaugeAboveFull: boolean;
}

/**
 * The factor method: minutes = (gauge − residual) × (contents ÷ full pressure) ÷ flow. The psi function in
 * cylinders.ts is unit-agnostic arithmetic, so bar cylinders use it with a litres-per-bar factor.
 *
 * The reserve mirrors the journey supply rule (need × (1 + reserve)): of what a cylinder holds, the share
 * reserve ÷ (1 + reserve) is kept back, so the time to use is minutesTotal ÷ (1 + reserve).
 */
export function cylinderTime(input: CylinderTimeInput): CylinderTime {
  const { cylinder, gauge, flowLpm, reservePercent } = input;
  if (!(cylinder.contentLitres > 0) || !(cylinder.fullPressure > 0)) throw new RangeError('A cylinder needs positive contents and full pressure');
  if (!Number.isFinite(reservePercent) || reservePercent < 0) throw new RangeError('Reserve must be 0 % or more');
  const factor = cylinder.contentLitres / cylinder.fullPressure;
  const minutesTotal = cylinderMinutesFromPsi({ gaugePsi: gauge, cylinderFactorLPerPsi: factor, flowLpm, residualPsi: cylinder.residualPressure });
  const minutesBeforeReserve = minutesTotal === null ? null : minutesTotal / (1 + reservePercent / 100);
  return {
    factor,
    usableLitres: Math.max(0, (gauge - cylinder.residualPressure) * factor),
    fractionLeft: cylinderRemainingFraction(gauge, cylinder.fullPressure, cylinder.residualPressure),
    minutesTotal,
    minutesBeforeReserve,
    reserveMinutes: minutesTotal === null || minutesBeforeReserve === null ? null : minutesTotal - minutesBeforeReserve,
    gaugeAboveFull: gauge > cylinder.fullPressure,
  };
}

/** Minutes a full cylinder gives at a flow, down to its change-over pressure; null at 0 L/min. */
export function fullCylinderMinutes(cylinder: CylinderSpec, flowLpm: number): number | null {
  return cylinderTime({ cylinder, gauge: cylinder.fullPressure, flowLpm, reservePercent: 0 }).minutesTotal;
}

/** "4 h 12 min" style text for families, rounded down so a family is never told it lasts longer than it does. */
export function hoursAndMinutesText(minutes: number): string {
  const whole = Math.max(0, Math.floor(minutes + 1e-9));
  const h = Math.floor(whole / 60);
  const m = whole % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}
