import { mmHgToKPa } from '@shared/clinical/units';
import type { WorkingUnit } from '@shared/clinical/working';
import { numberInWords } from '@shared/format/number-words';

// Display only: the numbers themselves come from shared/clinical. Flows are shown with up to 3 decimals and no
// trailing zeros, so a 1/8 L/min step reads 0.125 and is never rounded to a neighbouring step.
export function formatFlow(flowLpm: number): string {
  return String(Number(flowLpm.toFixed(3)));
}

export function formatFraction(fraction: number): string {
  return `${fraction.toFixed(4)} (${(fraction * 100).toFixed(1)} %)`;
}

export function formatPercentOfFraction(fraction: number): string {
  return `${(fraction * 100).toFixed(1)} %`;
}

export function formatMmHg(mmHg: number): string {
  return mmHg.toFixed(1);
}

export function formatKpa(mmHg: number): string {
  return mmHgToKPa(mmHg).toFixed(1);
}

/** Conversion units get their own precision; other sheets (a journey's minutes, cylinders, ft) read to 0.1. */
export function formatWorkingValue(value: number | null, unit: WorkingUnit | (string & {})): string {
  if (value === null) return '—';
  switch (unit) {
    case 'fraction':
      return formatFraction(value);
    case 'mmHg':
      return `${formatMmHg(value)} mmHg`;
    case 'L/min':
      return `${value.toFixed(3)} L/min`;
    case 'm':
      return `${Number(value.toFixed(1))} m`;
    case 'kg':
      return `${Number(value.toFixed(3))} kg`;
    case '%':
      return `${Number(value.toFixed(1))} %`;
    default:
      return `${numberInWords(Number(value.toFixed(1)))} ${unit}`;
  }
}
