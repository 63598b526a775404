import { describe, expect, it } from 'vitest';
import { localToInstant } from '../../../shared/schedule/local-time';

// UK clock changes in 2026: forward at 01:00 UTC on 29 March, back at 01:00 UTC on 25 October (common knowledge
// of the EU/UK rule: last Sunday of March and of October).
describe('family wall-clock times to instants', () => {
  it('when the time is ordinary, then winter is UTC and summer is UTC+1 in London', () => {
    expect(localToInstant('2026-12-03', '10:00', 'Europe/London')?.toISOString()).toBe('2026-12-03T10:00:00.000Z');
    expect(localToInstant('2026-07-03', '10:00', 'Europe/London')?.toISOString()).toBe('2026-07-03T09:00:00.000Z');
  });

  it('when the time falls in the hour skipped as clocks go forward, then there is no such instant', () => {
    expect(localToInstant('2026-03-29', '01:30', 'Europe/London')).toBeNull();
    expect(localToInstant('2026-03-29', '02:30', 'Europe/London')?.toISOString()).toBe('2026-03-29T01:30:00.000Z');
  });

  it('when the time falls in the repeated hour as clocks go back, then the earlier one is used', () => {
    expect(localToInstant('2026-10-25', '01:30', 'Europe/London')?.toISOString()).toBe('2026-10-25T00:30:00.000Z');
  });

  it('when another zone is given, then it is honoured', () => {
    expect(localToInstant('2026-12-03', '10:00', 'America/Denver')?.toISOString()).toBe('2026-12-03T17:00:00.000Z');
  });
});
