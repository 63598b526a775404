import { describe, expect, it } from 'vitest';
import { planBookingNote } from '@shared/reminders/timing';
import { localToInstant } from '@shared/schedule/local-time';

// Quiet hours 21:00–08:00, the programme default (the product brief). London is UTC+0 in December.
const quiet = { quietStart: '21:00', quietEnd: '08:00' };
const TZ = 'Europe/London';
const at = (date: string, time: string) => localToInstant(date, time, TZ)!;
const visit = (date: string, time: string) => ({ date, time, timeZone: TZ, startsAt: at(date, time) });

describe('the note that a visit was booked', () => {
  it('when a visit is booked for a later day in the afternoon, then a "booked" note goes at once', () => {
    expect(planBookingNote(visit('2026-12-05', '10:00'), quiet, at('2026-12-02', '14:00'))).toEqual({
      template: 'visit-booked', sendAt: at('2026-12-02', '14:00'), notAfter: at('2026-12-05', '10:00'), skip: null,
    });
  });

  it('when a visit is booked for today, then the short "today at" note goes at once', () => {
    expect(planBookingNote(visit('2026-12-02', '15:00'), quiet, at('2026-12-02', '11:30'))).toMatchObject({ template: 'visit-today', sendAt: at('2026-12-02', '11:30'), skip: null });
  });

  it('when a visit for tomorrow morning is booked late in the evening, then the note waits for the end of quiet hours and, being on the day, says "today"', () => {
    expect(planBookingNote(visit('2026-12-03', '09:00'), quiet, at('2026-12-02', '22:30'))).toMatchObject({ template: 'visit-today', sendAt: at('2026-12-03', '08:00'), skip: null });
    // Booked one minute before quiet hours: it goes at once, the day before, as a "booked" note.
    expect(planBookingNote(visit('2026-12-03', '09:00'), quiet, at('2026-12-02', '20:59'))).toMatchObject({ template: 'visit-booked', sendAt: at('2026-12-02', '20:59') });
  });

  it('when quiet hours would hold the note until the visit has started, then it is planned as skipped for quiet hours', () => {
    expect(planBookingNote(visit('2026-12-02', '23:30'), quiet, at('2026-12-02', '21:10'))).toMatchObject({ template: 'visit-today', skip: 'quiet-hours' });
    // Held until 08:00 for an 08:00 visit: the boundary counts as too late.
    expect(planBookingNote(visit('2026-12-03', '08:00'), quiet, at('2026-12-03', '06:00'))).toMatchObject({ skip: 'quiet-hours' });
    expect(planBookingNote(visit('2026-12-03', '08:01'), quiet, at('2026-12-03', '06:00'))).toMatchObject({ skip: null, sendAt: at('2026-12-03', '08:00') });
  });

  it('when the visit has already started, then there is no note', () => {
    expect(planBookingNote(visit('2026-12-02', '10:00'), quiet, at('2026-12-02', '10:00'))).toBeNull();
    expect(planBookingNote(visit('2026-12-02', '10:00'), quiet, at('2026-12-02', '09:59'))).toMatchObject({ template: 'visit-today', skip: null });
  });
});
