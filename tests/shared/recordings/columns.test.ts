import { describe, expect, it } from 'vitest';
import { hasMapping, resolveColumns } from '@shared/recordings/columns';

// The column rules of DEVELOPERS.md "Overnight recording files": our headers in any order and case; a mapping for
// other exports, where pulse may be absent. A column read as the wrong value (pulse as SpO2) would corrupt a night.
describe('finding the recording columns', () => {
  it('when our headers come in any order, case and spacing, then each value is read from its own column', () => {
    expect(resolveColumns([' PULSE ', 'Status', 'SpO2', 'TimeStamp'])).toEqual({ ok: true, columns: { timestamp: 3, spo2: 2, pulse: 0, status: 1 } });
    expect(resolveColumns(['timestamp', 'spo2', 'pulse'])).toEqual({ ok: true, columns: { timestamp: 0, spo2: 1, pulse: 2, status: null } });
  });

  it('when a mapping is given in other case, then it still finds the column, and a role left out falls back to ours', () => {
    const outcome = resolveColumns(['Time', 'Sat', 'spo2', 'status'], { timestampColumn: 'TIME', spo2Column: 'sat' });
    expect(outcome).toEqual({ ok: true, columns: { timestamp: 0, spo2: 1, pulse: null, status: 3 } });
  });

  it('when our own pulse column is missing without a mapping, then the file is refused; with one, pulse may be absent', () => {
    expect(resolveColumns(['timestamp', 'spo2']).ok).toBe(false);
    expect(resolveColumns(['timestamp', 'spo2'], { spo2Column: 'spo2' })).toEqual({ ok: true, columns: { timestamp: 0, spo2: 1, pulse: null, status: null } });
  });

  it('when a mapping is all blank keys, then it counts as no mapping', () => {
    expect(hasMapping(undefined)).toBe(false);
    expect(hasMapping({})).toBe(false);
    expect(hasMapping({ statusColumn: 'Quality' })).toBe(true);
  });

  it('when a mapped column is missing, then the message names it without the role prefix and lists what was found', () => {
    const outcome = resolveColumns(['Time', 'Sat'], { timestampColumn: 'Clock', spo2Column: 'Sat', pulseColumn: 'HR' });
    expect(outcome).toEqual({
      ok: false,
      found: ['Time', 'Sat'],
      missing: ['timestampColumn: Clock', 'pulseColumn: HR'],
      message: 'The file has no column named "Clock", "HR". Columns found: "Time", "Sat".',
    });
  });

  it('when our headers are missing without a mapping, then the message explains the format and asks for a mapping', () => {
    const outcome = resolveColumns(['a', 'b']);
    expect(outcome).toMatchObject({ ok: false, missing: ['timestamp', 'spo2', 'pulse'] });
    if (!outcome.ok) {
      expect(outcome.message).toBe(
        'The file\'s columns are not in the Nestflow recording format (timestamp, spo2, pulse, and optionally status). ' +
          'Columns found: "a", "b". Choose which column holds each value and upload again.',
      );
    }
    const none = resolveColumns([]);
    if (!none.ok) expect(none.message).toContain('Columns found: none.');
  });

  it('when one column is chosen for two values, then the file is refused rather than read twice', () => {
    const outcome = resolveColumns(['Time', 'Sat', 'HR'], { timestampColumn: 'Time', spo2Column: 'Sat', pulseColumn: 'sat' });
    expect(outcome).toMatchObject({ ok: false, missing: [] });
    if (!outcome.ok) expect(outcome.message).toBe('The columns cannot be read: one column is chosen for two different values. Columns found: "Time", "Sat", "HR".');
  });

  it('when a header appears twice, then the file is refused, naming it and the count', () => {
    const outcome = resolveColumns(['timestamp', 'spo2', 'SPO2', 'pulse']);
    if (outcome.ok) throw new Error('expected a refusal');
    expect(outcome.message).toBe('The columns cannot be read: the column "spo2" appears 2 times. Columns found: "timestamp", "spo2", "SPO2", "pulse".');
  });

  it('when a hostile header row is very long, then at most 50 headers of at most 60 characters go back', () => {
    const header = Array.from({ length: 80 }, (_, i) => `${'h'.repeat(70)}${i}`);
    const outcome = resolveColumns(header);
    if (outcome.ok) throw new Error('expected a refusal');
    expect(outcome.found).toHaveLength(50);
    expect(outcome.found[0]).toBe(`${'h'.repeat(60)}…`);
    expect(resolveColumns(['x'.repeat(60)]).ok || (resolveColumns(['x'.repeat(60)]) as { found: string[] }).found[0]).toBe('x'.repeat(60));
  });
});

describe('finding a date column and a time column', () => {
  it('when both are named, then the timestamp is null and each value has its own column', () => {
    expect(resolveColumns(['Datum', 'Uhrzeit', 'SpO2', 'Puls'], { dateColumn: 'datum', timeColumn: 'UHRZEIT', spo2Column: 'SpO2', pulseColumn: 'Puls' })).toEqual({
      ok: true, columns: { timestamp: null, date: 0, time: 1, spo2: 2, pulse: 3, status: null },
    });
  });

  it('when a date and time mapping is given, then an own "timestamp" column is not needed and not used', () => {
    expect(resolveColumns(['timestamp', 'Date', 'Time', 'spo2', 'status'], { dateColumn: 'Date', timeColumn: 'Time' })).toEqual({
      ok: true, columns: { timestamp: null, date: 1, time: 2, spo2: 3, pulse: null, status: 4 },
    });
  });

  it('when one of the pair is left out, then the other is missing by its field name', () => {
    expect(resolveColumns(['Date', 'SpO2'], { dateColumn: 'Date', spo2Column: 'SpO2' })).toMatchObject({ ok: false, missing: ['timeColumn'] });
    expect(resolveColumns(['Time', 'SpO2'], { timeColumn: 'Time', spo2Column: 'SpO2' })).toMatchObject({ ok: false, missing: ['dateColumn'] });
  });

  it('when the date column is also chosen as the time, then the file is refused rather than read twice', () => {
    const outcome = resolveColumns(['Date', 'SpO2'], { dateColumn: 'Date', timeColumn: 'date', spo2Column: 'SpO2' });
    expect(outcome).toMatchObject({ ok: false, missing: [] });
    if (!outcome.ok) expect(outcome.message).toBe('The columns cannot be read: one column is chosen for two different values. Columns found: "Date", "SpO2".');
  });

  it('when only a date or time column is given, then it counts as a mapping', () => {
    expect(hasMapping({ dateColumn: 'Date' })).toBe(true);
    expect(hasMapping({ timeColumn: 'Time' })).toBe(true);
    expect(hasMapping({ timestampColumn: 'Stamp' })).toBe(true);
  });
});
