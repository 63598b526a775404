import type { RecordingSummary } from '@shared/schemas/recordings';

// Display only: every figure comes from the server's analysis (shared/clinical/oximetry.ts).
const dash = '—';

/** 9 h 58 min of valid time reads "9:58". */
export function hoursMinutes(minutes: number): string {
  const whole = Math.round(minutes);
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

export const spo2Text = (value: number | null) => (value === null ? dash : `${value.toFixed(1)} %`);
export const shareText = (value: number | null) => (value === null ? dash : `${value.toFixed(1)} %`);
export const perHourText = (value: number | null) => (value === null ? dash : `${value.toFixed(1)} per hour`);
export const pulseText = (value: number | null) => (value === null ? dash : `${Math.round(value)} /min`);

/** 1.5 s, 45 s, 2 min 5 s. */
export function secondsText(seconds: number): string {
  const s = Math.round(seconds);
  return s < 60 ? `${s} s` : `${Math.floor(s / 60)} min${s % 60 ? ` ${s % 60} s` : ''}`;
}

export const shortHash = (sha256: string) => `${sha256.slice(0, 12)}…`;

export interface Figure {
  label: string;
  value: string;
}

export function summaryFigures(summary: RecordingSummary): Figure[] {
  return [
    { label: 'Valid time (h:mm)', value: hoursMinutes(summary.validMinutes) },
    { label: 'Mean SpO2', value: spo2Text(summary.meanSpo2) },
    { label: 'Median SpO2', value: spo2Text(summary.medianSpo2) },
    { label: 'Lowest SpO2', value: spo2Text(summary.minSpo2) },
    { label: 'Time below 90 %', value: shareText(summary.pctBelow90) },
    { label: 'Time below 92 %', value: shareText(summary.pctBelow92) },
    { label: 'Time below 93 %', value: shareText(summary.pctBelow93) },
    { label: 'ODI3', value: perHourText(summary.odi3) },
    { label: 'ODI4', value: perHourText(summary.odi4) },
    { label: 'Mean pulse', value: pulseText(summary.meanPulse) },
  ];
}
