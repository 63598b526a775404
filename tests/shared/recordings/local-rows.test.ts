import { describe, expect, it } from 'vitest';
import { addLocalRow, createLocalRows, localRowsToInstants } from '@shared/recordings/local-rows';

describe('rows with a local date and time', () => {
  it('when cells carry spaces, then they are read and written back trimmed', () => {
    const rows = createLocalRows();
    expect(addLocalRow(rows, ' 24/11/2026 ', ' 21:00:00 ', 7)).toEqual({ ok: true, value: null });
    expect(rows).toEqual({ dates: [{ first: 24, second: 11, third: 2026, yearFirst: false }], clocks: [75_600_000], lines: [7], written: ['24/11/2026 21:00:00'] });
  });

  it('when a cell is not a date, not a time or not both, then the reason quotes it, cut at 40 characters', () => {
    const rows = createLocalRows();
    expect(addLocalRow(rows, '24-11', '21:00', 2)).toEqual({ ok: false, reason: 'date "24-11" is not a date' });
    expect(addLocalRow(rows, '24/11/2026', 'late', 3)).toEqual({ ok: false, reason: 'time "late" is not a clock time' });
    expect(addLocalRow(rows, ` ${'x'.repeat(40)} `, null, 4)).toEqual({ ok: false, reason: `"${'x'.repeat(40)}" is not a date and time` });
    expect(addLocalRow(rows, 'y'.repeat(41), null, 5)).toEqual({ ok: false, reason: `"${'y'.repeat(40)}…" is not a date and time` });
    expect(rows.lines).toEqual([]);
  });

  it('when a row is no calendar date in the order chosen, then its time is null and it is listed; the others are read', () => {
    const rows = createLocalRows();
    addLocalRow(rows, '31/04/2026', '21:00', 2);
    addLocalRow(rows, '30/04/2026', '21:00', 3);
    expect(localRowsToInstants(rows, { dateOrder: 'dmy', timeZone: 'UTC' })).toEqual({
      ok: true, order: 'dmy', times: [null, Date.parse('2026-04-30T21:00:00Z')], bad: [{ line: 2, reason: 'date "31/04/2026" is not a date in day/month/year order' }],
    });
  });
});
