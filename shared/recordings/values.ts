/**
 * Reading single cells of an overnight recording file. Every function returns a value or a reason; none throws,
 * so one bad cell costs one row, never the upload.
 */

/** Values are kept to 0.1 (SpO2 %, pulse bpm) and times to 1 ms: what is read is exactly what is stored. */
export const VALUE_STEPS_PER_UNIT = 10;
/** Largest storable value in steps (6553.3); a number beyond it or below 0 is kept as an out-of-range artefact. */
export const MAX_VALUE_STEPS = 0xfffd;

export type Cell<T> = { ok: true; value: T } | { ok: false; reason: string };

// A decimal point or a decimal comma (exports with `;` between values write 97,5).
const DECIMAL = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/;
const SECONDS = /^\+?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/;
const asNumber = (text: string) => Number(text.replace(',', '.'));
const ISO_WITHOUT_OFFSET = /^\d{4}-\d{2}-\d{2}[Tt ]\d{2}:\d{2}(?::\d{2}(?:[.,]\d+)?)?$/;
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

const shown = (raw: string) => (raw.length > 40 ? `${raw.slice(0, 40)}…` : raw);
const isLeap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
const daysIn = (year: number, month: number) => (month === 2 && isLeap(year) ? 29 : DAYS_IN_MONTH[month - 1]);

/** The number in s[from, from + count) if every character is a digit, else -1. */
function digits(s: string, from: number, count: number): number {
  if (from + count > s.length) return -1;
  let value = 0;
  for (let i = from; i < from + count; i += 1) {
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return -1;
    value = value * 10 + d;
  }
  return value;
}

/**
 * Reads YYYY-MM-DD, T or space, hh:mm, optional :ss and a fraction, then Z or ±hh[:mm] in milliseconds since
 * 1970, or NaN. Character by character, because a night holds tens of thousands of these and a regular
 * expression with captures was most of the parse time.
 */
function readIso(s: string): number {
  const sep = s.charCodeAt(10);
  if (s.charCodeAt(4) !== 45 || s.charCodeAt(7) !== 45 || (sep !== 84 && sep !== 116 && sep !== 32) || s.charCodeAt(13) !== 58) return NaN;
  const year = digits(s, 0, 4);
  const month = digits(s, 5, 2);
  const day = digits(s, 8, 2);
  const hour = digits(s, 11, 2);
  const minute = digits(s, 14, 2);
  let i = 16;
  let second = 0;
  let fractionMs = 0;
  if (s.charCodeAt(i) === 58) {
    second = digits(s, i + 1, 2);
    i += 3;
    const dot = s.charCodeAt(i);
    if (dot === 46 || dot === 44) {
      let scale = 100;
      let j = i + 1;
      for (; j < s.length && j < i + 10; j += 1) {
        const d = s.charCodeAt(j) - 48;
        if (d < 0 || d > 9) break;
        fractionMs += d * scale;
        scale /= 10;
      }
      if (j === i + 1) return NaN;
      i = j;
    }
  }
  let offsetMin = 0;
  const z = s.charCodeAt(i);
  if (z === 90 || z === 122) i += 1;
  else if (z === 43 || z === 45) {
    const oh = digits(s, i + 1, 2);
    i += 3;
    if (s.charCodeAt(i) === 58) i += 1;
    const om = i < s.length ? digits(s, i, 2) : 0;
    if (i < s.length) i += 2;
    if (oh < 0 || om < 0 || oh > 23 || om > 59) return NaN;
    offsetMin = (z === 45 ? -1 : 1) * (oh * 60 + om);
  } else return NaN;
  if (i !== s.length || (year | month | day | hour | minute | second) < 0) return NaN;
  // Years before 1900 are typing errors here, and Date.UTC would read 0–99 as 1900–1999.
  if (year < 1900 || month < 1 || month > 12 || day < 1 || day > daysIn(year, month) || hour > 23 || minute > 59 || second > 59) return NaN;
  return Date.UTC(year, month - 1, day, hour, minute, second) + Math.round(fractionMs) - offsetMin * 60_000;
}

/**
 * An ISO-8601 date-time in milliseconds since 1970. An offset (Z or ±hh:mm) is required: a local clock time is
 * ambiguous across a daylight-saving change, which can fall in the middle of a night.
 */
export function parseIsoMs(raw: string): Cell<number> {
  const text = raw.trim();
  const ms = readIso(text);
  if (!Number.isNaN(ms)) return { ok: true, value: ms };
  if (ISO_WITHOUT_OFFSET.test(text)) return { ok: false, reason: `timestamp "${shown(text)}" has no time-zone offset (add Z or, for example, +01:00)` };
  return { ok: false, reason: `timestamp "${shown(text)}" is not an ISO-8601 date-time with a time-zone offset` };
}

/** Seconds from the start of the recording, in milliseconds. */
export function parseSecondsMs(raw: string): Cell<number> {
  const text = raw.trim();
  if (!SECONDS.test(text)) return { ok: false, reason: `time "${shown(text)}" is not a number of seconds` };
  const value = Math.round(asNumber(text) * 1000);
  if (!Number.isSafeInteger(value)) return { ok: false, reason: `time "${shown(text)}" is too large` };
  return { ok: true, value };
}

export const looksLikeSeconds = (raw: string) => SECONDS.test(raw.trim());

/**
 * An SpO2 or pulse cell. Empty means missing (null). A number outside 0–6553.3 becomes NaN: the row is kept as
 * an artefact the analysis excludes, because devices write codes such as -1 for "no reading".
 */
export function parseValue(raw: string, column: string): Cell<number | null> {
  const text = raw.trim();
  if (text === '') return { ok: true, value: null };
  if (!DECIMAL.test(text)) return { ok: false, reason: `${column} "${shown(text)}" is not a number` };
  const steps = Math.round(asNumber(text) * VALUE_STEPS_PER_UNIT);
  if (!(steps >= 0 && steps <= MAX_VALUE_STEPS)) return { ok: true, value: Number.NaN };
  // "+ 0" turns a "-0" cell into 0, so the value equals what the store gives back.
  return { ok: true, value: steps / VALUE_STEPS_PER_UNIT + 0 };
}

/** Any status other than blank or "ok" marks the sample as flagged by the device. */
export const isFlaggedStatus = (raw: string) => {
  const text = raw.trim();
  return text !== '' && text.toLowerCase() !== 'ok';
};
