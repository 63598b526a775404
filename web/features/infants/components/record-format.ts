import { formatFlow, formatKpa, formatMmHg } from '../../../components/clinical/clinical-format';

const dateOnly = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** A calendar date (YYYY-MM-DD) as "1 Apr 2025"; read as UTC so no time zone moves it a day. */
export function formatDate(isoDate: string): string {
  const date = new Date(`${isoDate.slice(0, 10)}T00:00:00Z`);
  return Number.isNaN(date.getTime()) ? isoDate : dateOnly.format(date);
}

export const flowText = (flowLpm: number | null | undefined) => (flowLpm === null || flowLpm === undefined ? '—' : `${formatFlow(flowLpm)} L/min`);

export function pressureText(pressureMmHg: number): string {
  return `${formatMmHg(pressureMmHg)} mmHg (${formatKpa(pressureMmHg)} kPa)`;
}

/** "1,780 m" or, when the family gave a measured pressure instead, "measured". */
export function homePlaceText(elevationM: number | null, pressureMmHg: number): string {
  const where = elevationM === null ? 'measured' : `${elevationM.toLocaleString('en-GB')} m`;
  return `${where} · ${pressureText(pressureMmHg)}`;
}

export const SOURCE_WORDS: Record<string, string> = {
  cylinder: 'Cylinder',
  concentrator: 'Concentrator',
  blended: 'Blended',
};
