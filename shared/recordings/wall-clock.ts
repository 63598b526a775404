import { TZDate } from '@date-fns/tz';

/**
 * Clock times read in a time zone, with the daylight-saving change: the hour skipped when the clocks go forward
 * exists nowhere, and the hour repeated when they go back names two moments. A device whose clock follows the
 * change writes the repeated hour twice, so the file's own order settles which pass a row belongs to: rows before
 * the clock steps back (from one repeated time to an earlier one) are the first pass, rows after it the second.
 */

const MINUTE_MS = 60_000;
const QUARTER_HOUR_MS = 15 * MINUTE_MS;
const DAY_MS = 24 * 60 * MINUTE_MS;

export type WallTimeOutcome =
  | { kind: 'one'; at: number }
  | { kind: 'twice'; earlier: number; later: number }
  | { kind: 'none'; shiftMs: number };

/**
 * `wallMs` is the clock reading written as if it were UTC (Date.UTC of the local fields). Offsets change on the
 * quarter hour in every zone in use, so one look-up per quarter hour serves a whole night.
 */
export function createZoneClock(timeZone: string): (wallMs: number) => WallTimeOutcome {
  const cache = new Map<number, number>();
  const offsetAt = (instant: number) => {
    const key = Math.floor(instant / QUARTER_HOUR_MS);
    let offset = cache.get(key);
    if (offset === undefined) {
      offset = -new TZDate(key * QUARTER_HOUR_MS, timeZone).getTimezoneOffset() * MINUTE_MS;
      cache.set(key, offset);
    }
    return offset;
  };
  return (wallMs) => {
    // No zone changes its offset twice within two days: the offsets a day either side are the only candidates.
    const before = offsetAt(wallMs - DAY_MS);
    const after = offsetAt(wallMs + DAY_MS);
    const fits = [wallMs - before, wallMs - after].filter((at) => at + offsetAt(at) === wallMs);
    if (fits.length === 0) return { kind: 'none', shiftMs: after - before };
    if (fits.length === 1 || fits[0] === fits[1]) return { kind: 'one', at: fits[0] };
    return { kind: 'twice', earlier: Math.min(...fits), later: Math.max(...fits) };
  };
}

const span = (ms: number) => {
  const minutes = Math.abs(ms) / MINUTE_MS;
  if (minutes % 60 !== 0) return `${minutes} minutes`;
  return minutes === 60 ? 'an hour' : `${minutes / 60} hours`;
};

export type InstantsOutcome = { ok: true; times: number[] } | { ok: false; index: number; message: string };

/**
 * Every row's clock reading as an instant, in file order. `shown(i)` gives row i's date and time as written, with
 * its line, for the message.
 */
export function wallTimesToInstants(walls: readonly number[], timeZone: string, shown: (index: number) => string): InstantsOutcome {
  const clock = createZoneClock(timeZone);
  const times: number[] = [];
  let steppedBack = false;
  let firstUnsettled = -1;
  let repeatMs = 0;
  let previousTwice = false;
  for (let i = 0; i < walls.length; i += 1) {
    const outcome = clock(walls[i]);
    if (outcome.kind === 'none') {
      const message = `${shown(i)} does not exist in ${timeZone}: the clocks went forward ${span(outcome.shiftMs)} that night. ` +
        'The oximeter’s clock may not have changed with them. Check its clock, choose the time zone it keeps (for example UTC) and upload again.';
      return { ok: false, index: i, message };
    }
    if (outcome.kind === 'one') {
      times.push(outcome.at);
      previousTwice = false;
      continue;
    }
    // The device's clock stepped back within the repeated span: from here on it is the second pass.
    if (previousTwice && walls[i] < walls[i - 1]) steppedBack = true;
    previousTwice = true;
    if (!steppedBack && firstUnsettled < 0) firstUnsettled = i;
    repeatMs = outcome.later - outcome.earlier;
    times.push(steppedBack ? outcome.later : outcome.earlier);
  }
  if (firstUnsettled >= 0 && !steppedBack) {
    const message = `${shown(firstUnsettled)} happens twice on this night in ${timeZone} (the clocks went back ${span(repeatMs)}), ` +
      'and the file does not show which of the two it is. If the oximeter’s clock does not change for summer time, choose the time zone it keeps (for example UTC) and upload again.';
    return { ok: false, index: firstUnsettled, message };
  }
  return { ok: true, times };
}
