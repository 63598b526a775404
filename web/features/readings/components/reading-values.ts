import { READING_STATE_LABELS, type Reading } from '@shared/schemas/readings';
import { formatFlow } from '../../../components/clinical/clinical-format';

/** Empty notes are left out rather than stored as an empty string. */
export const asOptionalText = {
  setValueAs: (value: unknown) => (typeof value === 'string' && value.trim() !== '' ? value : undefined),
};

const pad = (n: number) => String(n).padStart(2, '0');

/** The value a datetime-local box shows for an instant, in the phone's own time (the nurse is at the door). */
export function toLocalInput(iso: string | undefined): string {
  if (!iso) return '';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Back from the box to an ISO instant; an empty or half-typed box stays empty so the schema asks for the time. */
export function fromLocalInput(local: string): string {
  if (!local) return '';
  const d = new Date(local);
  return Number.isNaN(d.getTime()) ? '' : d.toISOString();
}

const time = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });
const dayAndTime = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

export const formatTime = (iso: string) => time.format(new Date(iso));
export const formatDayAndTime = (iso: string) => dayAndTime.format(new Date(iso));

/** "SpO2 95 % · pulse 142 /min · 0.25 L/min · Asleep" — the figures exactly as saved. */
export function readingFigures(reading: Reading): string[] {
  const parts = [`SpO2 ${reading.spo2} %`];
  if (reading.pulse !== null) parts.push(`pulse ${reading.pulse} /min`);
  if (reading.flowLpm !== null) parts.push(reading.flowLpm === 0 ? '0 L/min (room air)' : `${formatFlow(reading.flowLpm)} L/min`);
  parts.push(READING_STATE_LABELS[reading.state]);
  if (reading.weightKg !== null) parts.push(`weight ${Number(reading.weightKg.toFixed(3))} kg`);
  return parts;
}
