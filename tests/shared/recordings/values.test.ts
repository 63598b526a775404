import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { isFlaggedStatus, looksLikeSeconds, parseIsoMs, parseSecondsMs, parseValue } from '@shared/recordings/values';

// Timestamps follow RFC 3339, the internet profile of ISO 8601 (date, "T" or a space, time, fraction, then "Z" or
// ±hh:mm); DEVELOPERS.md "Overnight recording files" lists what our reader accepts. A clock time read wrongly moves
// every event of the night, so each field's limits are checked here one by one.
const ms = (text: string) => {
  const cell = parseIsoMs(text);
  return cell.ok ? cell.value : null;
};

describe('reading ISO-8601 timestamps', () => {
  it('when a timestamp carries Z or an offset, then it is the instant it names', () => {
    expect(ms('2026-11-20T21:00:00Z')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('2026-11-20t21:00:00z')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('2026-11-20 22:00:00+01:00')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('2026-11-20T15:30:00-05:30')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('2026-11-20T22:00:00+0100')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('2026-11-20T22:00:00+01')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('2026-11-20T21:00Z')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
    expect(ms('  2026-11-20T21:00:00Z  ')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0));
  });

  it('when a timestamp has a fraction of a second, then it is kept to the millisecond with a dot or a comma', () => {
    expect(ms('2026-11-20T21:00:00.5Z')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0, 500));
    expect(ms('2026-11-20T21:00:00,25Z')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0, 250));
    expect(ms('2026-11-20T21:00:00.123456789Z')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0, 123));
    expect(ms('2026-11-20T21:00:00.1234567891Z')).toBeNull();
    expect(ms('2026-11-20T21:00:00.Z')).toBeNull();
  });

  it('when a date does not exist, then the timestamp is refused, leap days included', () => {
    // Gregorian leap years: every 4th year, except centuries not divisible by 400 (common knowledge).
    expect(ms('2024-02-29T00:00:00Z')).toBe(Date.UTC(2024, 1, 29));
    expect(ms('2000-02-29T00:00:00Z')).toBe(Date.UTC(2000, 1, 29));
    expect(ms('2023-02-29T00:00:00Z')).toBeNull();
    expect(ms('1900-02-29T00:00:00Z')).toBeNull();
    expect(ms('2026-02-28T00:00:00Z')).toBe(Date.UTC(2026, 1, 28));
    expect(ms('2026-04-30T00:00:00Z')).toBe(Date.UTC(2026, 3, 30));
    expect(ms('2026-04-31T00:00:00Z')).toBeNull();
    expect(ms('2026-12-31T00:00:00Z')).toBe(Date.UTC(2026, 11, 31));
    expect(ms('2026-13-01T00:00:00Z')).toBeNull();
    expect(ms('2026-00-10T00:00:00Z')).toBeNull();
    expect(ms('2026-01-00T00:00:00Z')).toBeNull();
    expect(ms('2026-01-01T00:00:00Z')).toBe(Date.UTC(2026, 0, 1));
    expect(ms('1900-01-01T00:00:00Z')).toBe(Date.UTC(1900, 0, 1));
    expect(ms('1899-12-31T00:00:00Z')).toBeNull();
  });

  it('when a clock field is out of range, then the timestamp is refused', () => {
    expect(ms('2026-11-20T23:59:59Z')).toBe(Date.UTC(2026, 10, 20, 23, 59, 59));
    expect(ms('2026-11-20T24:00:00Z')).toBeNull();
    expect(ms('2026-11-20T21:60:00Z')).toBeNull();
    expect(ms('2026-11-20T21:00:60Z')).toBeNull();
    expect(ms('2026-11-20T21:00:00+23:59')).toBe(Date.UTC(2026, 10, 20, 21, 0, 0) - (23 * 60 + 59) * 60_000);
    expect(ms('2026-11-20T21:00:00+24:00')).toBeNull();
    expect(ms('2026-11-20T21:00:00+01:60')).toBeNull();
  });

  it('when the shape is wrong anywhere, then the timestamp is refused', () => {
    for (const text of [
      '2026/11/20T21:00:00Z',
      '2026-11/20T21:00:00Z',
      '2026-11-20X21:00:00Z',
      '2026-11-20T21-00:00Z',
      '2026-1a-20T21:00:00Z',
      '2026-11-20T2:00:00Z',
      '2026-11-20T21:00:0Z',
      '2026-11-20T21:00:00ZZ',
      '2026-11-20T21:00:00+1',
      '2026-11-20T21:00:00+ab:00',
      '2026-11-20T21:00:00+01:0x',
      '2026-11-20T21:00:00 +01:00',
      '2026-11-20T21:0',
      '2026-11-20',
    ]) {
      expect(ms(text), text).toBeNull();
    }
  });

  it('when the offset is missing, then the reason says so; other refusals say what form is expected', () => {
    // A local time is ambiguous across a daylight-saving change (DEVELOPERS.md), so the fix is named.
    expect(parseIsoMs('2026-11-20T21:00:00')).toEqual({ ok: false, reason: 'timestamp "2026-11-20T21:00:00" has no time-zone offset (add Z or, for example, +01:00)' });
    expect(parseIsoMs('2026-11-20 21:00')).toMatchObject({ ok: false, reason: expect.stringMatching(/no time-zone offset/) });
    expect(parseIsoMs('yesterday')).toEqual({ ok: false, reason: 'timestamp "yesterday" is not an ISO-8601 date-time with a time-zone offset' });
  });

  it('when a bad cell is long, then the reason quotes its first 40 characters only', () => {
    const long = 'x'.repeat(39) + 'yz' + 'q'.repeat(20);
    const cell = parseIsoMs(long);
    expect(cell.ok).toBe(false);
    if (!cell.ok) expect(cell.reason).toContain(`"${'x'.repeat(39)}y…"`);
    const forty = 'x'.repeat(40);
    const exact = parseIsoMs(forty);
    if (!exact.ok) expect(exact.reason).toContain(`"${forty}"`);
  });

  it('when any valid RFC 3339 timestamp is read, then it equals the instant Date.UTC gives for its fields', () => {
    const two = (n: number) => String(n).padStart(2, '0');
    fc.assert(
      fc.property(
        fc.date({ min: new Date(Date.UTC(1900, 0, 1)), max: new Date(Date.UTC(2100, 11, 31, 23, 59, 59, 999)), noInvalidDate: true }),
        fc.integer({ min: -23 * 60 - 59, max: 23 * 60 + 59 }),
        fc.constantFrom('T', 't', ' '),
        fc.boolean(),
        (date, offsetMin, sep, colon) => {
          const d = new Date(date.getTime() + offsetMin * 60_000); // wall clock at that offset
          const sign = offsetMin < 0 ? '-' : '+';
          const abs = Math.abs(offsetMin);
          const offset = offsetMin === 0 && colon ? 'Z' : `${sign}${two(Math.floor(abs / 60))}${colon ? ':' : ''}${two(abs % 60)}`;
          const text = `${d.getUTCFullYear()}-${two(d.getUTCMonth() + 1)}-${two(d.getUTCDate())}${sep}${two(d.getUTCHours())}:${two(d.getUTCMinutes())}:${two(d.getUTCSeconds())}.${String(d.getUTCMilliseconds()).padStart(3, '0')}${offset}`;
          if (d.getUTCFullYear() < 1900 || d.getUTCFullYear() > 9999) return;
          expect(parseIsoMs(text), text).toEqual({ ok: true, value: date.getTime() });
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('reading seconds from the start', () => {
  it('when a number of seconds is given, then it is kept to the millisecond', () => {
    expect(parseSecondsMs('0')).toEqual({ ok: true, value: 0 });
    expect(parseSecondsMs(' 0.5 ')).toEqual({ ok: true, value: 500 });
    expect(parseSecondsMs('+3')).toEqual({ ok: true, value: 3000 });
    expect(parseSecondsMs('.25')).toEqual({ ok: true, value: 250 });
    expect(parseSecondsMs('1.0004')).toEqual({ ok: true, value: 1000 });
  });

  it('when the cell is not a plain non-negative number, then it is refused with the reason', () => {
    expect(parseSecondsMs('-1')).toEqual({ ok: false, reason: 'time "-1" is not a number of seconds' });
    expect(parseSecondsMs('1e3').ok).toBe(false);
    expect(parseSecondsMs('').ok).toBe(false);
    expect(parseSecondsMs('12:00').ok).toBe(false);
  });

  it('when the number is too large to count in milliseconds exactly, then it is refused', () => {
    expect(parseSecondsMs('99999999999999999')).toEqual({ ok: false, reason: 'time "99999999999999999" is too large' });
    expect(parseSecondsMs('93600')).toEqual({ ok: true, value: 93_600_000 }); // 26 h, the longest upload
  });

  it('when a file is read with automatic detection, then only plain numbers look like seconds', () => {
    expect(looksLikeSeconds(' 12.5 ')).toBe(true);
    expect(looksLikeSeconds('2026-11-20T21:00:00Z')).toBe(false);
  });
});

describe('reading SpO2 and pulse cells', () => {
  it('when a value is given, then it is kept to 0.1, rounding halves up', () => {
    // Stored in tenths (DEVELOPERS.md: values kept to 0.1), so what is read is exactly what is stored.
    expect(parseValue(' 97 ', 'SpO2')).toEqual({ ok: true, value: 97 });
    expect(parseValue('97.25', 'SpO2')).toEqual({ ok: true, value: 97.3 });
    expect(parseValue('97.24', 'SpO2')).toEqual({ ok: true, value: 97.2 });
    expect(parseValue('+96', 'SpO2')).toEqual({ ok: true, value: 96 });
  });

  it('when a cell is empty, then the value is missing, not zero', () => {
    expect(parseValue('', 'pulse')).toEqual({ ok: true, value: null });
    expect(parseValue('   ', 'pulse')).toEqual({ ok: true, value: null });
  });

  it('when a device writes a number outside 0–6553.3 (such as -1 for "no reading"), then it is kept as an artefact', () => {
    expect(parseValue('-1', 'SpO2')).toEqual({ ok: true, value: Number.NaN });
    expect(parseValue('6553.4', 'pulse')).toEqual({ ok: true, value: Number.NaN });
    expect(parseValue('6553.3', 'pulse')).toEqual({ ok: true, value: 6553.3 });
    expect(parseValue('0', 'SpO2')).toEqual({ ok: true, value: 0 });
  });

  it('when a cell reads "-0", then it is stored as 0, the value the store gives back', () => {
    const cell = parseValue('-0', 'SpO2');
    expect(cell.ok && Object.is(cell.value, 0)).toBe(true);
  });

  it('when a cell is not a number, then the reason names the column and the cell', () => {
    expect(parseValue('ninety', 'SpO2')).toEqual({ ok: false, reason: 'SpO2 "ninety" is not a number' });
    expect(parseValue('9,7,5', 'pulse')).toEqual({ ok: false, reason: 'pulse "9,7,5" is not a number' });
  });

  it('when a value uses a decimal comma, as exports separated by semicolons do, then it reads as the decimal point would', () => {
    expect(parseValue('97,5', 'SpO2')).toEqual({ ok: true, value: 97.5 });
    expect(parseValue(',5', 'SpO2')).toEqual({ ok: true, value: 0.5 });
    expect(parseSecondsMs('1,25')).toEqual({ ok: true, value: 1250 });
  });
});

describe('device status cells', () => {
  it('when the status is blank or "ok" in any case, then the sample is good; any other text flags it', () => {
    expect(isFlaggedStatus('')).toBe(false);
    expect(isFlaggedStatus('  ')).toBe(false);
    expect(isFlaggedStatus(' OK ')).toBe(false);
    expect(isFlaggedStatus('probe off')).toBe(true);
    expect(isFlaggedStatus('okay')).toBe(true);
  });
});
