import type { PolicySettings } from '@shared/schemas/policy';
import type { Reading } from '@shared/schemas/readings';

export interface TargetBand {
  min: number;
  max: number;
}

/** The programme's mean SpO2 target (the higher one with pulmonary hypertension) up to 100 %. */
export function targetBand(settings: PolicySettings, pulmonaryHypertension: boolean): TargetBand {
  const t = settings.spo2Targets;
  return { min: pulmonaryHypertension ? t.pulmonaryHypertensionMeanMin : t.overnightMeanMin, max: 100 };
}

const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short' });

/** The readings chart in words: its span, the band, and how many readings fell below it. */
export function readingsDescription(readings: readonly Reading[], band: TargetBand): string {
  if (readings.length === 0) return 'No readings yet.';
  const times = readings.map((r) => Date.parse(r.takenAt));
  const from = day.format(new Date(Math.min(...times)));
  const to = day.format(new Date(Math.max(...times)));
  const below = readings.filter((r) => r.spo2 < band.min).length;
  const family = readings.filter((r) => r.familyReported).length;
  return (
    `${readings.length} SpO2 ${readings.length === 1 ? 'reading' : 'readings'} from ${from} to ${to}, against the target band ${band.min}–${band.max} % (shaded); ` +
    `${below} below ${band.min} %.` +
    (family ? ` Hollow points: ${family} reported by the family.` : '')
  );
}
