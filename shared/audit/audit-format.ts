import { numberInWords } from '../format/number-words';

/** Small readers for the free-form `details` of an audit event: a value of the wrong type reads as absent. */
export type Details = Record<string, unknown>;

export const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
export const str = (value: unknown): string | null => (typeof value === 'string' && value.trim() !== '' ? value : null);
export const obj = (value: unknown): Details | null => (value && typeof value === 'object' && !Array.isArray(value) ? (value as Details) : null);
export const list = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);

export function flowWords(value: unknown): string {
  const flow = num(value);
  if (flow === null) return 'an unknown flow';
  return flow === 0 ? 'no oxygen (0 L/min)' : `${numberInWords(flow)} L/min`;
}

const PERIOD_NAMES: Record<string, string> = { awake: 'awake', asleep: 'asleep', feeding: 'feeding' };

/** "0.1 L/min", or per part of the day when the setting differs: "awake no oxygen (0 L/min), asleep 0.1 L/min". */
export function settingWords(flowLpm: unknown, periods: unknown): string {
  const parts = obj(periods);
  if (!parts) return flowWords(flowLpm);
  const entries = Object.entries(parts).filter(([key]) => key in PERIOD_NAMES);
  return entries.length ? entries.map(([key, value]) => `${PERIOD_NAMES[key]} ${flowWords(value)}`).join(', ') : flowWords(flowLpm);
}

/** A stored value as a person reads it; objects and lists are described, never dumped as JSON. */
export function valueWords(value: unknown): string {
  if (value === null || value === undefined || value === '') return 'nothing';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') return numberInWords(value);
  if (typeof value === 'string') return `“${value}”`;
  return 'a new value';
}

/** "from A to B"; "set to B" when there was nothing before. */
export function fromTo(from: unknown, to: unknown, unit = ''): string {
  const u = unit ? ` ${unit}` : '';
  const before = valueWords(from);
  return before === 'nothing' ? `set to ${valueWords(to)}${u}` : `from ${before}${u} to ${valueWords(to)}${u}`;
}

const dayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** A calendar date as stored (YYYY-MM-DD), read at UTC noon so no browser zone moves it. */
export function dayWords(value: unknown): string {
  const date = str(value);
  if (!date || !/^\d{4}-\d{2}-\d{2}$/.test(date)) return 'an unknown day';
  return dayFormat.format(new Date(`${date}T12:00:00Z`));
}

export function joinWords(items: string[]): string {
  if (items.length <= 1) return items[0] ?? '';
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}
