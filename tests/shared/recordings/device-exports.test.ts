import { describe, expect, it } from 'vitest';
import { createRecordingParser, parseRecordingCsv, type RecordingParseResult } from '@shared/recordings/recording-parser';
import { DEVICE_PREAMBLE, deviceExport } from '../../fixtures/recordings/device-export';

const ok = (r: RecordingParseResult) => {
  if (!r.ok) throw new Error(`expected a recording, got ${r.problem.code}: ${r.problem.message}`);
  return r.recording;
};
const problem = (r: RecordingParseResult) => {
  if (r.ok) throw new Error('expected a refusal');
  return r.problem;
};
const dateAndTime = { dateColumn: 'Date', timeColumn: 'Time', spo2Column: 'SpO2', pulseColumn: 'Pulse' };
const london = { columns: dateAndTime, timeZone: 'Europe/London' };

// UK clock changes in 2026 (Summer Time Order 2002, SI 2002/262): forward 29 March 01:00 GMT, back 25 October
// 01:00 GMT. Device export shapes as issue #13 describes them (common practice).
describe('device exports with local date and time columns', () => {
  it('when a winter night is exported with text lines first, semicolons and decimal commas, then it reads in the family’s zone', () => {
    const text = deviceExport({ startUtc: '2026-11-24T21:00:00Z', hours: 2, periodSec: 2, clockZone: 'Europe/London', preamble: DEVICE_PREAMBLE });
    const rec = ok(parseRecordingCsv(text, london));
    expect(rec).toMatchObject({ timeFormat: 'iso', startedAt: '2026-11-24T21:00:00.000Z', samplePeriodSec: 2, durationSec: 7200, dataRows: 3600, skippedRows: 0 });
    expect(rec.samples[1]).toEqual({ tSec: 2, spo2: 97.5, pulse: 141.5, flagged: false });
    expect(rec.header).toEqual(['Date', 'Time', 'SpO2', 'Pulse']);
  });

  it('when a summer night is read in London, then the clock reading is an hour ahead of UTC', () => {
    const text = deviceExport({ startUtc: '2026-07-01T20:00:00Z', hours: 1, periodSec: 10, clockZone: 'Europe/London', separator: '\t', order: 'ymd' });
    expect(ok(parseRecordingCsv(text, london)).startedAt).toBe('2026-07-01T20:00:00.000Z');
  });

  it('when the night crosses the change back and the clock followed it, then the repeated hour counts twice: 9 hours, not 8', () => {
    const text = deviceExport({ startUtc: '2026-10-24T21:00:00Z', hours: 9, periodSec: 4, clockZone: 'Europe/London', preamble: DEVICE_PREAMBLE });
    const rec = ok(parseRecordingCsv(text, london));
    expect(rec).toMatchObject({ startedAt: '2026-10-24T21:00:00.000Z', durationSec: 9 * 3600, samplePeriodSec: 4, dataRows: 8100 });
    // Evenly spaced in real time across the change: no sample lands on another.
    expect(rec.samples.every((s, i) => s.tSec === i * 4)).toBe(true);
  });

  it('when the night crosses the change forward and the clock followed it, then the skipped hour is not counted: 7 hours', () => {
    const text = deviceExport({ startUtc: '2026-03-28T22:00:00Z', hours: 7, periodSec: 4, clockZone: 'Europe/London' });
    expect(ok(parseRecordingCsv(text, london))).toMatchObject({ startedAt: '2026-03-28T22:00:00.000Z', durationSec: 7 * 3600 });
  });

  it('when the clock stayed on summer time through the change back, then the first repeated time is named with its line', () => {
    // Etc/GMT-1 is a fixed UTC+1 clock (the IANA sign is reversed).
    const text = deviceExport({ startUtc: '2026-10-24T21:00:00Z', hours: 8, periodSec: 60, clockZone: 'Etc/GMT-1', preamble: DEVICE_PREAMBLE });
    const p = problem(parseRecordingCsv(text, london));
    // 22:00 → 01:00 is 180 rows after the header on line 5.
    expect(p).toMatchObject({ code: 'clock_change', line: 186, details: { found: ['Date', 'Time', 'SpO2', 'Pulse'] } });
    expect(p.message).toBe(
      'Line 186: 25/10/2026 01:00:00 happens twice on this night in Europe/London (the clocks went back an hour), and the file does not show which of the two it is. ' +
        'If the oximeter’s clock does not change for summer time, choose the time zone it keeps (for example UTC) and upload again.',
    );
    expect(ok(parseRecordingCsv(text, { ...london, timeZone: 'Etc/GMT-1' })).durationSec).toBe(8 * 3600);
  });

  it('when the clock stayed on winter time through the change forward, then the first skipped time is named with its line', () => {
    const text = deviceExport({ startUtc: '2026-03-28T22:00:00Z', hours: 7, periodSec: 60, clockZone: 'UTC' });
    const p = problem(parseRecordingCsv(text, london));
    expect(p).toMatchObject({ code: 'clock_change', line: 182 });
    expect(p.message).toMatch(/^Line 182: 29\/03\/2026 01:00:00 does not exist in Europe\/London: the clocks went forward an hour that night\./);
  });

  it('when no date settles day and month, then the order is asked for with the first unclear line and the headers', () => {
    const text = deviceExport({ startUtc: '2026-04-03T21:00:00Z', hours: 2, periodSec: 60, clockZone: 'UTC' });
    const p = problem(parseRecordingCsv(text, { columns: dateAndTime, timeZone: 'UTC' }));
    expect(p).toEqual({
      code: 'date_order_unclear', line: 2, details: { found: ['Date', 'Time', 'SpO2', 'Pulse'] },
      message: 'Line 2: 03/04/2026 21:00:00 could be day/month/year or month/day/year, and no date in the file settles it. Choose the date order and upload again.',
    });
    expect(ok(parseRecordingCsv(text, { columns: dateAndTime, timeZone: 'UTC', dateOrder: 'dmy' })).startedAt).toBe('2026-04-03T21:00:00.000Z');
    expect(ok(parseRecordingCsv(text, { columns: dateAndTime, timeZone: 'UTC', dateOrder: 'mdy' })).startedAt).toBe('2026-03-04T21:00:00.000Z');
  });

  it('when the dates are month first, then a day above 12 settles it', () => {
    const text = deviceExport({ startUtc: '2026-11-24T21:00:00Z', hours: 1, periodSec: 10, clockZone: 'UTC', order: 'mdy', separator: ',' });
    expect(ok(parseRecordingCsv(text, { columns: dateAndTime, timeZone: 'UTC' })).startedAt).toBe('2026-11-24T21:00:00.000Z');
  });

  it('when a chosen order makes a row no calendar date, then that row is unreadable, in words, in line order', () => {
    const text = deviceExport({ startUtc: '2026-11-24T21:00:00Z', hours: 1, periodSec: 10, clockZone: 'UTC', separator: ',' });
    const p = problem(parseRecordingCsv(text.replace('24/11/2026,21:00:10', '24/11/2026,late'), { columns: dateAndTime, timeZone: 'UTC', dateOrder: 'mdy' }));
    expect(p).toMatchObject({ code: 'unreadable_rows', line: 2 });
    expect((p.details?.lines ?? []).slice(0, 2)).toEqual([
      'line 2: date "24/11/2026" is not a date in month/day/year order', 'line 3: time "late" is not a clock time',
    ]);
  });

  it('when one column holds the local date and time, then "auto" reads it in the zone given', () => {
    const text = ['Recorded;SpO2;Pulse', ...Array.from({ length: 60 }, (_, i) => `24/11/2026 21:${String(i).padStart(2, '0')};97;140`)].join('\n');
    const rec = ok(parseRecordingCsv(text, { columns: { timestampColumn: 'Recorded', spo2Column: 'SpO2', pulseColumn: 'Pulse' }, timeZone: 'Europe/Paris' }));
    expect(rec).toMatchObject({ startedAt: '2026-11-24T20:00:00.000Z', durationSec: 3600 });
  });

  it('when the cell is neither a date and time nor seconds, then the reason says so', () => {
    const text = ['Recorded,SpO2,Pulse', ...Array.from({ length: 60 }, () => 'soon,97,140')].join('\n');
    const p = problem(parseRecordingCsv(text, { columns: { timestampColumn: 'Recorded', spo2Column: 'SpO2' }, timeZone: 'UTC' }));
    expect(p.message).toContain('first at line 2: "soon" is not a date and time.');
  });

  it('when a local row also has a bad SpO2, then it is reported once, for SpO2, and not kept aside', () => {
    const text = deviceExport({ startUtc: '2026-11-24T21:00:00Z', hours: 1, periodSec: 10, clockZone: 'UTC', separator: ',' }).replace('21:00:10,97.5', '21:00:10,high');
    const rec = ok(parseRecordingCsv(text, { columns: dateAndTime, timeZone: 'UTC' }));
    expect(rec).toMatchObject({ dataRows: 360, skippedRows: 1 });
    expect(rec.samples).toHaveLength(359);
  });

  it('when the file arrives in small pieces, then the result is the same as whole', () => {
    const text = deviceExport({ startUtc: '2026-10-24T23:30:00Z', hours: 2, periodSec: 30, clockZone: 'Europe/London', preamble: DEVICE_PREAMBLE });
    const parser = createRecordingParser(london);
    for (let at = 0; at < text.length; at += 7) expect(parser.push(text.slice(at, at + 7))).toBeNull();
    expect(parser.finish()).toEqual(parseRecordingCsv(text, london));
  });

  it('when no time zone is given to the reader, then local times are read as UTC', () => {
    const text = deviceExport({ startUtc: '2026-11-24T21:00:00Z', hours: 1, periodSec: 10, clockZone: 'UTC' });
    expect(ok(parseRecordingCsv(text, { columns: dateAndTime })).startedAt).toBe('2026-11-24T21:00:00.000Z');
  });
});
