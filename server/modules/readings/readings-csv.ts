import { READING_STATE_LABELS } from '@shared/schemas/readings';
import type { ReadingExportRow } from '../../db/repositories/readings.repository';
import { isoInZone, yesNo, type CsvColumn } from '../../lib/csv';

const num = (v: string | number | null) => (v === null ? null : Number(v));

/** The columns of a baby's readings export; times in the programme's zone, named in the heading. */
export const readingColumns = (timeZone: string): CsvColumn<ReadingExportRow>[] => [
  { heading: `Taken at (ISO 8601, ${timeZone})`, value: (r) => isoInZone(r.taken_at, timeZone) },
  { heading: 'SpO2 (%)', value: (r) => r.spo2 },
  { heading: 'Pulse (/min)', value: (r) => r.pulse },
  { heading: 'Flow (L/min)', value: (r) => num(r.flow_lpm) },
  { heading: 'State', value: (r) => READING_STATE_LABELS[r.state as keyof typeof READING_STATE_LABELS] ?? r.state },
  { heading: 'Weight (kg)', value: (r) => num(r.weight_kg) },
  { heading: 'Notes', value: (r) => r.notes },
  { heading: 'Reported by the family', value: (r) => yesNo(r.family_reported) },
  { heading: 'Logged by', value: (r) => r.created_by_name },
  { heading: `Logged at (ISO 8601, ${timeZone})`, value: (r) => isoInZone(r.created_at, timeZone) },
  { heading: 'Reading id', value: (r) => r.id },
];
