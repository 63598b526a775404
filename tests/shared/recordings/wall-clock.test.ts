import { describe, expect, it } from 'vitest';
import { createZoneClock, wallTimesToInstants } from '@shared/recordings/wall-clock';

// UK clock changes: the Summer Time Act 1972 as amended by the Summer Time Order 2002 (SI 2002/262), in line with
// EU Directive 2000/84/EC — forward at 01:00 GMT on the last Sunday of March, back at 01:00 GMT on the last Sunday
// of October. In 2026 those are 29 March and 25 October. Lord Howe Island moves 30 minutes (IANA tz database).
const wall = (iso: string) => Date.parse(`${iso}Z`);
const at = (iso: string) => Date.parse(iso);
const shown = (i: number) => `Line ${i + 2}: row ${i}`;

describe('a clock reading in a time zone', () => {
  it('when the time exists once, then it is that instant (GMT in winter, BST in summer)', () => {
    const london = createZoneClock('Europe/London');
    expect(london(wall('2026-11-24T21:00:00'))).toEqual({ kind: 'one', at: at('2026-11-24T21:00:00Z') });
    expect(london(wall('2026-07-01T21:00:00'))).toEqual({ kind: 'one', at: at('2026-07-01T20:00:00Z') });
  });

  it('when the clocks go forward, then 01:00–01:59 does not exist and 00:59:59 and 02:00 do', () => {
    const london = createZoneClock('Europe/London');
    expect(london(wall('2026-03-29T00:59:59'))).toEqual({ kind: 'one', at: at('2026-03-29T00:59:59Z') });
    expect(london(wall('2026-03-29T01:00:00'))).toEqual({ kind: 'none', shiftMs: 3_600_000 });
    expect(london(wall('2026-03-29T01:59:59'))).toEqual({ kind: 'none', shiftMs: 3_600_000 });
    expect(london(wall('2026-03-29T02:00:00'))).toEqual({ kind: 'one', at: at('2026-03-29T01:00:00Z') });
  });

  it('when the clocks go back, then 01:00–01:59 happens twice, an hour apart, and 02:00 once', () => {
    const london = createZoneClock('Europe/London');
    expect(london(wall('2026-10-25T00:59:59'))).toEqual({ kind: 'one', at: at('2026-10-24T23:59:59Z') });
    expect(london(wall('2026-10-25T01:00:00'))).toEqual({ kind: 'twice', earlier: at('2026-10-25T00:00:00Z'), later: at('2026-10-25T01:00:00Z') });
    expect(london(wall('2026-10-25T01:59:59'))).toEqual({ kind: 'twice', earlier: at('2026-10-25T00:59:59Z'), later: at('2026-10-25T01:59:59Z') });
    expect(london(wall('2026-10-25T02:00:00'))).toEqual({ kind: 'one', at: at('2026-10-25T02:00:00Z') });
  });

  it('when the zone moves half an hour, then the skipped and repeated spans are half an hour', () => {
    const lordHowe = createZoneClock('Australia/Lord_Howe');
    // Back at 02:00 (+11) to 01:30 (+10:30) on the first Sunday of April 2026.
    expect(lordHowe(wall('2026-04-05T01:45:00'))).toEqual({ kind: 'twice', earlier: at('2026-04-04T14:45:00Z'), later: at('2026-04-04T15:15:00Z') });
  });
});

describe('a night of clock readings as instants', () => {
  it('when a device follows the change back, then the repeated hour is the first pass before the step back and the second after', () => {
    const walls = ['00:59:00', '01:30:00', '01:59:00', '01:00:00', '01:30:00', '02:00:00'].map((t) => wall(`2026-10-25T${t}`));
    expect(wallTimesToInstants(walls, 'Europe/London', shown)).toEqual({
      ok: true,
      times: ['2026-10-24T23:59:00Z', '2026-10-25T00:30:00Z', '2026-10-25T00:59:00Z', '2026-10-25T01:00:00Z', '2026-10-25T01:30:00Z', '2026-10-25T02:00:00Z'].map(at),
    });
  });

  it('when the repeated hour appears once only, then the first such row is named in words and nothing is guessed', () => {
    const walls = ['00:59:00', '01:30:00', '01:45:00', '02:00:00'].map((t) => wall(`2026-10-25T${t}`));
    expect(wallTimesToInstants(walls, 'Europe/London', shown)).toEqual({
      ok: false, index: 1,
      message: 'Line 3: row 1 happens twice on this night in Europe/London (the clocks went back an hour), and the file does not show which of the two it is. ' +
        'If the oximeter’s clock does not change for summer time, choose the time zone it keeps (for example UTC) and upload again.',
    });
  });

  it('when a row falls in the skipped hour, then it is named in words with what to do', () => {
    const walls = ['00:59:00', '01:30:00', '02:30:00'].map((t) => wall(`2026-03-29T${t}`));
    expect(wallTimesToInstants(walls, 'Europe/London', shown)).toEqual({
      ok: false, index: 1,
      message: 'Line 3: row 1 does not exist in Europe/London: the clocks went forward an hour that night. ' +
        'The oximeter’s clock may not have changed with them. Check its clock, choose the time zone it keeps (for example UTC) and upload again.',
    });
  });

  it('when a zone skips half an hour, then the message says 30 minutes', () => {
    // Lord Howe Island goes forward from 02:00 to 02:30 on the first Sunday of October 2026.
    const outcome = wallTimesToInstants([wall('2026-10-04T02:15:00')], 'Australia/Lord_Howe', shown);
    expect(outcome.ok === false && outcome.message).toContain('the clocks went forward 30 minutes that night');
  });

  it('when the night crosses the change forward cleanly, then the hour is simply missing from the clock', () => {
    const walls = ['00:59:00', '02:00:00'].map((t) => wall(`2026-03-29T${t}`));
    expect(wallTimesToInstants(walls, 'Europe/London', shown)).toEqual({ ok: true, times: [at('2026-03-29T00:59:00Z'), at('2026-03-29T01:00:00Z')] });
  });

  it('when the rows step back outside the repeated hour, then that does not settle a repeated time', () => {
    const walls = ['02:30:00', '02:10:00', '01:30:00'].map((t) => wall(`2026-10-25T${t}`));
    expect(wallTimesToInstants(walls, 'Europe/London', shown)).toMatchObject({ ok: false, index: 2 });
  });
});
