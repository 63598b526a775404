import { DATE_ORDER_WORDS, readClockTime, readDateParts, settleDateOrder, splitDateTime, toCalendarDate, type DateOrder, type DateParts } from './local-dates';
import type { Cell } from './values';
import { wallTimesToInstants } from './wall-clock';

/**
 * Rows whose time is a local date and clock time, kept as read until the whole file is in: the date order may be
 * settled by a row near the end, and the daylight-saving pass by the order of rows.
 */
export interface LocalRows {
  dates: DateParts[];
  clocks: number[];
  lines: number[];
  written: string[];
}

export const createLocalRows = (): LocalRows => ({ dates: [], clocks: [], lines: [], written: [] });

const shownCell = (raw: string) => (raw.length > 40 ? `${raw.slice(0, 40)}…` : raw);

/** Reads a date cell and a time cell (or one cell holding both, when `time` is null) into the rows. */
export function addLocalRow(rows: LocalRows, date: string, time: string | null, line: number): Cell<null> {
  const pair = time === null ? splitDateTime(date) : [date.trim(), time.trim()];
  if (!pair) return { ok: false, reason: `"${shownCell(date.trim())}" is not a date and time` };
  const parts = readDateParts(pair[0]);
  if (!parts) return { ok: false, reason: `date "${shownCell(pair[0])}" is not a date` };
  const clock = readClockTime(pair[1]);
  if (clock === null) return { ok: false, reason: `time "${shownCell(pair[1])}" is not a clock time` };
  rows.dates.push(parts);
  rows.clocks.push(clock);
  rows.lines.push(line);
  rows.written.push(`${pair[0]} ${pair[1]}`);
  return { ok: true, value: null };
}

export interface LocalTimesOptions {
  dateOrder?: DateOrder;
  timeZone: string;
}

export type LocalTimesOutcome =
  | { ok: true; times: Array<number | null>; bad: Array<{ line: number; reason: string }>; order: DateOrder }
  | { ok: false; code: 'date_order_unclear' | 'clock_change'; line: number; message: string };

/** The instant of every row (null for a row whose date is no calendar date in the order used). */
export function localRowsToInstants(rows: LocalRows, options: LocalTimesOptions): LocalTimesOutcome {
  const shown = (i: number) => `Line ${rows.lines[i]}: ${rows.written[i]}`;
  let order = options.dateOrder;
  if (!order) {
    const settled = settleDateOrder(rows.dates, shown);
    if (!settled.ok) return { ok: false, code: 'date_order_unclear', line: rows.lines[settled.index], message: settled.message };
    order = settled.order;
  }
  const bad: Array<{ line: number; reason: string }> = [];
  const walls: number[] = [];
  const kept: number[] = [];
  rows.dates.forEach((parts, i) => {
    const date = toCalendarDate(parts, order);
    if (!date) {
      bad.push({ line: rows.lines[i], reason: `date "${rows.written[i].split(' ')[0]}" is not a date in ${DATE_ORDER_WORDS[order]} order` });
      return;
    }
    walls.push(Date.UTC(date.year, date.month - 1, date.day) + rows.clocks[i]);
    kept.push(i);
  });
  const instants = wallTimesToInstants(walls, options.timeZone, (k) => shown(kept[k]));
  if (!instants.ok) return { ok: false, code: 'clock_change', line: rows.lines[kept[instants.index]], message: instants.message };
  const times: Array<number | null> = rows.dates.map(() => null);
  kept.forEach((i, k) => {
    times[i] = instants.times[k];
  });
  return { ok: true, times, bad, order };
}
