import { describe, expect, it } from 'vitest';
import { localToInstant } from '@shared/schedule/local-time';

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

  it('when a zone moves its clocks by 30 minutes (Lord Howe Island), then the repeated half hour gives the earlier instant', () => {
    // Lord Howe Island keeps +10:30 in winter and +11 in summer (IANA tz database); on 5 April 2026 02:00 +11
    // becomes 01:30 +10:30, so 01:35 happens twice: 14:35 UTC, then 15:05 UTC. A reminder must not come late.
    expect(localToInstant('2026-04-05', '01:35', 'Australia/Lord_Howe')?.toISOString()).toBe('2026-04-04T14:35:00.000Z');
    expect(localToInstant('2026-04-05', '02:00', 'Australia/Lord_Howe')?.toISOString()).toBe('2026-04-04T15:30:00.000Z');
    // On 4 October 2026 02:00 +10:30 becomes 02:30 +11: 02:15 does not exist that night.
    expect(localToInstant('2026-10-04', '02:15', 'Australia/Lord_Howe')).toBeNull();
    expect(localToInstant('2026-10-04', '02:30', 'Australia/Lord_Howe')?.toISOString()).toBe('2026-10-03T15:30:00.000Z');
  });

  it('when a whole local day was skipped (Samoa, 30 December 2011), then no time on it exists', () => {
    // Samoa moved across the date line from −10 to +14 and skipped 30 December 2011 (IANA tz database).
    expect(localToInstant('2011-12-30', '10:00', 'Pacific/Apia')).toBeNull();
    expect(localToInstant('2011-12-31', '10:00', 'Pacific/Apia')?.toISOString()).toBe('2011-12-30T20:00:00.000Z');
  });

  it('when the date or time is not a real one, then there is no instant rather than a rolled-over one', () => {
    expect(localToInstant('2026-13-01', '10:00', 'Europe/London')).toBeNull();
    expect(localToInstant('2026-02-30', '10:00', 'Europe/London')).toBeNull();
    expect(localToInstant('2026-12-03', '24:00', 'Europe/London')).toBeNull();
  });

  it('when the time is just after the clocks went back, then it is used as it stands', () => {
    // 02:30 on 25 October 2026 happens once in London (GMT, after the repeated 01:00–02:00 hour).
    expect(localToInstant('2026-10-25', '02:30', 'Europe/London')?.toISOString()).toBe('2026-10-25T02:30:00.000Z');
  });
});

