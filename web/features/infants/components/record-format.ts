import { formatFlow, formatKpa, formatMmHg } from '../../../components/clinical/clinical-format';
import { numberInWords } from '@shared/format/number-words';

export { formatDate } from '../../../lib/format';

export const flowText = (flowLpm: number | null | undefined) => (flowLpm === null || flowLpm === undefined ? '—' : `${formatFlow(flowLpm)} L/min`);

export function pressureText(pressureMmHg: number): string {
  return `${formatMmHg(pressureMmHg)} mmHg (${formatKpa(pressureMmHg)} kPa)`;
}

/** "1,780 m" or, when the family gave a measured pressure instead, "measured". */
export function homePlaceText(elevationM: number | null, pressureMmHg: number): string {
  const where = elevationM === null ? 'measured' : `${numberInWords(elevationM)} m`;
  return `${where} · ${pressureText(pressureMmHg)}`;
}

export const SOURCE_WORDS: Record<string, string> = {
  cylinder: 'Cylinder',
  concentrator: 'Concentrator',
  blended: 'Blended',
};
