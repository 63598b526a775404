import { describe, expect, it } from 'vitest';
import { parseRecordingCsv, type RecordingParseResult } from '@shared/recordings/recording-parser';
import { csvFromSamples, steadySamples } from '../../fixtures/recordings/build-csv';

const ok = (r: RecordingParseResult) => {
  if (!r.ok) throw new Error(`expected a recording, got ${r.problem.code}: ${r.problem.message}`);
  return r.recording;
};
const problem = (r: RecordingParseResult) => {
  if (r.ok) throw new Error('expected a refusal');
  return r.problem;
};
const rows = (n: number, row: (i: number) => string, header = 'timestamp,spo2,pulse') =>
  [header, ...Array.from({ length: n }, (_, i) => row(i))].join('\n') + '\n';

describe('recording files: our own format', () => {
  it('when timestamps carry an offset, then times count from the earliest sample and startedAt is in UTC', () => {
    const text = rows(60, (i) => `2026-11-20T21:${String(i).padStart(2, '0')}:00+01:00,97,140`);
    const rec = ok(parseRecordingCsv(text));
    expect(rec.startedAt).toBe('2026-11-20T20:00:00.000Z');
    expect(rec.samples[1]).toEqual({ tSec: 60, spo2: 97, pulse: 140, flagged: false });
    expect(rec).toMatchObject({ timeFormat: 'iso', samplePeriodSec: 60, durationSec: 3600, dataRows: 60, skippedRows: 0 });
  });

  it('when timestamps are seconds from start, then "auto" reads them as seconds and there is no clock time', () => {
    const rec = ok(parseRecordingCsv(rows(60, (i) => `${i * 0.5},97.5,140`)));
    expect(rec).toMatchObject({ timeFormat: 'seconds', startedAt: null, samplePeriodSec: 0.5 });
    expect(rec.samples[3]).toEqual({ tSec: 1.5, spo2: 97.5, pulse: 140, flagged: false });
  });

  it('when rows arrive out of time order, then the samples come back sorted', () => {
    const rec = ok(parseRecordingCsv(rows(60, (i) => `${59 - i},${40 + i},140`)));
    expect(rec.samples.map((s) => s.tSec)).toEqual(Array.from({ length: 60 }, (_, i) => i));
    expect(rec.samples[0].spo2).toBe(99);
  });

  it('when a row holds artefacts, then they are kept as such: flagged status, 0, 127, -1 and blank', () => {
    const text = rows(60, (i) => [`${i},97,140,ok`, `${i},0,140,`, `${i},127,140,OK`, `${i},-1,140,probe off`, `${i},,,ok`][i % 5], 'timestamp,spo2,pulse,status');
    const s = ok(parseRecordingCsv(text)).samples;
    expect(s.slice(0, 5)).toEqual([
      { tSec: 0, spo2: 97, pulse: 140, flagged: false },
      { tSec: 1, spo2: 0, pulse: 140, flagged: false },
      { tSec: 2, spo2: 127, pulse: 140, flagged: false },
      { tSec: 3, spo2: Number.NaN, pulse: 140, flagged: true },
      { tSec: 4, spo2: null, pulse: null, flagged: false },
    ]);
  });

  it('when there are more columns than ours, then the extra ones are ignored', () => {
    const rec = ok(parseRecordingCsv(rows(60, (i) => `x,${i},97,140`, 'note,Timestamp , SpO2,PULSE')));
    expect(rec.samples[5]).toEqual({ tSec: 5, spo2: 97, pulse: 140, flagged: false });
  });
});

describe('recording files: refusals', () => {
  it('when "iso" is chosen and a timestamp has no offset, then the reason says so and names the line', () => {
    const p = problem(parseRecordingCsv(rows(60, (i) => `2026-11-20T21:00:${String(i).padStart(2, '0')},97,140`), { timeFormat: 'iso' }));
    expect(p).toMatchObject({ code: 'unreadable_rows', line: 2 });
    expect(p.message).toMatch(/60 of 60 rows could not be read.*line 2: timestamp "2026-11-20T21:00:00" has no time-zone offset/);
  });

  it('when up to 1 % of rows cannot be read, then they are skipped; one more and the file is refused at the first', () => {
    const bad = (badRows: number[]) => rows(200, (i) => (badRows.includes(i) ? `soon,97,140` : `${i},97,140`));
    expect(ok(parseRecordingCsv(bad([10, 20]))).skippedRows).toBe(2);
    const p = problem(parseRecordingCsv(bad([10, 20, 30])));
    expect(p).toMatchObject({ code: 'unreadable_rows', line: 12, details: { lines: ['line 12: time "soon" is not a number of seconds', 'line 22: time "soon" is not a number of seconds', 'line 32: time "soon" is not a number of seconds'] } });
    expect(p.message).toBe('3 of 200 rows could not be read (at most 2 may be skipped); first at line 12: time "soon" is not a number of seconds.');
  });

  it('when "iso" is chosen for a file of seconds, or formats are mixed, then the rows are unreadable', () => {
    expect(problem(parseRecordingCsv(rows(60, (i) => `${i},97,140`), { timeFormat: 'iso' })).code).toBe('unreadable_rows');
    const mixed = rows(60, (i) => (i % 2 ? `${i},97,140` : `2026-11-20T21:00:${String(i).padStart(2, '0')}Z,97,140`));
    expect(problem(parseRecordingCsv(mixed)).message).toMatch(/30 of 60 rows/);
  });

  it('when a value is text, then the row is unreadable', () => {
    expect(problem(parseRecordingCsv(rows(60, (i) => `${i},ninety,140`))).message).toMatch(/SpO2 "ninety" is not a number/);
  });

  it('when fewer than 60 samples or more than 26 h, then too_short or too_long', () => {
    expect(problem(parseRecordingCsv(rows(59, (i) => `${i},97,140`))).code).toBe('too_short');
    expect(ok(parseRecordingCsv(rows(60, (i) => `${i},97,140`))).samples).toHaveLength(60);
    expect(problem(parseRecordingCsv(rows(60, (i) => `${i * 1600},97,140`)))).toMatchObject({ code: 'too_long' });
    expect(ok(parseRecordingCsv(rows(60, (i) => `${i * 1500},97,140`))).durationSec).toBe(90_000);
  });

  it('when the file has no rows or is not valid CSV, then empty_file or malformed_csv with the line', () => {
    expect(problem(parseRecordingCsv('\n\n')).code).toBe('empty_file');
    expect(problem(parseRecordingCsv('timestamp,spo2,pulse\n')).code).toBe('too_short');
    expect(problem(parseRecordingCsv('timestamp,spo2,pulse\n0,97,140\n1,97\n'))).toMatchObject({ code: 'malformed_csv', line: 3 });
  });
});

describe('recording files: columns', () => {
  const other = csvFromSamples(steadySamples(60), { time: 'seconds', headers: { timestamp: 'Time (s)', spo2: 'SpO2 %', pulse: 'Pulse rate', status: 'Quality' } });

  it('when the headers are not ours and no mapping is given, then wrong_columns lists the headers found', () => {
    expect(problem(parseRecordingCsv(other))).toMatchObject({
      code: 'wrong_columns', line: 1, details: { found: ['Time (s)', 'SpO2 %', 'Pulse rate', 'Quality'], missing: ['timestamp', 'spo2', 'pulse'] },
    });
  });

  it('when a mapping names the columns, then the same file reads; pulse and status may be left out', () => {
    const columns = { timestampColumn: 'time (s)', spo2Column: 'SpO2 %', pulseColumn: 'Pulse rate', statusColumn: 'Quality' };
    expect(ok(parseRecordingCsv(other, { columns })).samples).toEqual(steadySamples(60));
    const noPulse = ok(parseRecordingCsv(other, { columns: { timestampColumn: 'Time (s)', spo2Column: 'SpO2 %' } }));
    expect(noPulse.samples[0]).toEqual({ tSec: 0, spo2: 96, pulse: null, flagged: false });
  });

  it('when a mapped column is missing or a header appears twice, then wrong_columns says which', () => {
    expect(problem(parseRecordingCsv(other, { columns: { timestampColumn: 'Clock', spo2Column: 'SpO2 %' } })).message).toMatch(/no column named "Clock"/);
    expect(problem(parseRecordingCsv(rows(60, (i) => `${i},97,98,140`, 'timestamp,spo2,SpO2,pulse'))).message).toMatch(/"spo2" appears 2 times/);
  });
});

describe('recording files: what a refusal says', () => {
  // DEVELOPERS.md "Limits and refusals": a refused file says why, at which line, with at most five lines listed.
  it('when many rows are unreadable, then the first five are listed, each with its reason', () => {
    const p = problem(parseRecordingCsv(rows(60, (i) => (i < 8 ? `${i},97,fast` : `${i},97,140`))));
    expect(p.details!.lines).toEqual([2, 3, 4, 5, 6].map((line) => `line ${line}: pulse "fast" is not a number`));
  });

  it('when a timestamp is blank under automatic detection, then the reason says it is empty', () => {
    const p = problem(parseRecordingCsv(rows(60, (i) => (i < 3 ? `,97,140` : `${i},97,140`))));
    expect(p.details!.lines[0]).toBe('line 2: the timestamp is empty');
  });

  it('when a file is too short, then the message gives the count in words that fit it', () => {
    expect(problem(parseRecordingCsv(rows(1, () => '0,97,140'))).message).toBe('The file holds 1 readable sample; at least 60 are needed.');
    expect(problem(parseRecordingCsv(rows(2, (i) => `${i},97,140`))).message).toBe('The file holds 2 readable samples; at least 60 are needed.');
  });

  it('when a file spans exactly 26 h, then it is accepted; longer and the message gives the hours', () => {
    // 60 rows 1560 s apart: last at 92,040 s plus one period = 93,600 s = 26 h (computed).
    expect(ok(parseRecordingCsv(rows(60, (i) => `${i * 1560},97,140`))).durationSec).toBe(93_600);
    expect(problem(parseRecordingCsv(rows(60, (i) => `${i * 1600},97,140`))).message).toBe(
      'The recording spans 26.7 hours; one upload may span at most 26 hours (one night).',
    );
  });

  it('when the file is not valid CSV, then the line is given in the message and the details', () => {
    const p = problem(parseRecordingCsv('timestamp,spo2,pulse\n0,97,140\n1,97\n'));
    expect(p).toEqual({ code: 'malformed_csv', line: 3, message: 'The file is not valid CSV. Line 3 has 2 values but the header has 3.', details: { line: ['3'] } });
    expect(problem(parseRecordingCsv('timestamp,spo2,pulse\n0,"97,140\n'))).toMatchObject({ code: 'malformed_csv', line: 2 });
    expect(problem(parseRecordingCsv('\n'))).toEqual({ code: 'empty_file', message: 'The file has no rows.' });
  });

  it('when rows out of order share a time, then they keep the order they had in the file', () => {
    const text = rows(60, (i) => (i === 0 ? '5,91,140' : i === 1 ? '5,92,140' : `${200 - i},97,140`));
    const samples = ok(parseRecordingCsv(text)).samples.filter((s) => s.tSec === 0);
    expect(samples.map((s) => s.spo2)).toEqual([91, 92]);
  });

  it('when a mapping names a pulse column whose cell is text, then the reason names the pulse', () => {
    const p = problem(parseRecordingCsv(rows(60, (i) => `${i},97,${i < 3 ? 'x' : 140}`, 'Time,Sat,HR'), { columns: { timestampColumn: 'Time', spo2Column: 'Sat', pulseColumn: 'HR' } }));
    expect(p.details!.lines[0]).toBe('line 2: pulse "x" is not a number');
  });
});
