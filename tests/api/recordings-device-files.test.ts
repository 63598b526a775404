import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { makeClinic } from '../helpers/infants';
import { DEVICE_PREAMBLE, deviceExport, type DeviceNight } from '../fixtures/recordings/device-export';
import { enrolledBaby, storedFor, uploadRecording, type Clinic } from '../fixtures/recordings/upload';

let ctx: TestContext;
let clinic: Clinic;
let other: Clinic;
let babyId: string;
beforeAll(async () => {
  ctx = await createTestContext();
  clinic = await makeClinic(ctx.deps);
  other = await makeClinic(ctx.deps);
  babyId = (await enrolledBaby(ctx, clinic, clinic.people.family.email)).id;
});
afterAll(() => ctx.close());

const as = (email: string) => signedInAgent(ctx.app, email);
const columns = { dateColumn: 'Date', timeColumn: 'Time', spo2Column: 'SpO2', pulseColumn: 'Pulse' };
const HEADERS = 'Date\nTime\nSpO2\nPulse';
// The family's contact is in Europe/London (tests/helpers/infants.ts); UK clocks went back on 25 October 2026 at
// 01:00 GMT (Summer Time Order 2002, SI 2002/262).
const autumnNight = (extra: Partial<DeviceNight> = {}) =>
  deviceExport({ startUtc: '2026-10-24T21:00:00Z', hours: 9, periodSec: 10, clockZone: 'Europe/London', preamble: DEVICE_PREAMBLE, ...extra });

describe('device exports with local date and time columns', () => {
  it('when a night across the clock change comes with date and time columns and no zone, then it is read in the family’s zone: 9 hours', async () => {
    const nurse = await as(clinic.people.nurse.email);
    const res = await uploadRecording(nurse, babyId, autumnNight(), columns).expect(202);
    const recording = (await nurse.get(`/api/recordings/${res.body.id}`).expect(200)).body;
    expect(recording).toMatchObject({ startedAt: '2026-10-24T21:00:00.000Z', durationMinutes: 540, sampleCount: 3240, timeFormat: 'iso', skippedRows: 0 });
  });

  it('when the device clock did not change, then 400 clock_change names the line in words and nothing is stored', async () => {
    const coord = await as(clinic.people.coordinator.email);
    const before = await storedFor(ctx, babyId);
    const res = await uploadRecording(coord, babyId, autumnNight({ clockZone: 'Etc/GMT-1', hours: 8 }), columns).expect(400);
    expect(res.body.error).toMatchObject({ code: 'clock_change', details: { line: ['1086'] } });
    expect(res.body.error.message).toMatch(/^Line 1086: 25\/10\/2026 01:00:00 happens twice on this night in Europe\/London \(the clocks went back an hour\)/);
    expect(await storedFor(ctx, babyId)).toEqual(before);
    // Told the device keeps UTC+1 all year, the same file reads.
    await uploadRecording(coord, babyId, autumnNight({ clockZone: 'Etc/GMT-1', hours: 8 }), { ...columns, timeZone: 'Etc/GMT-1' }).expect(202);
  });

  it('when no date settles the order, then 400 date_order_unclear with the headers; with dateOrder the file reads', async () => {
    const coord = await as(clinic.people.coordinator.email);
    const april = deviceExport({ startUtc: '2026-04-03T19:00:00Z', hours: 2, periodSec: 10, clockZone: 'Europe/London' });
    const res = await uploadRecording(coord, babyId, april, columns).expect(400);
    expect(res.body.error).toMatchObject({ code: 'date_order_unclear', details: { line: ['2'], found: ['Date', 'Time', 'SpO2', 'Pulse'] } });
    const ok = await uploadRecording(coord, babyId, april, { ...columns, dateOrder: 'dmy' }).expect(202);
    expect((await coord.get(`/api/recordings/${ok.body.id}`)).body.startedAt).toBe('2026-04-03T19:00:00.000Z');
  });

  it('when the new fields are wrong, then 400 with a message per field', async () => {
    const coord = await as(clinic.people.coordinator.email);
    const night = autumnNight({ hours: 1 });
    const errorOf = async (fields: Record<string, string>) => (await uploadRecording(coord, babyId, night, fields).expect(400)).body.error;
    expect(await errorOf({ dateColumn: 'Date', spo2Column: 'SpO2' })).toMatchObject({ code: 'validation_failed', details: { timeColumn: ['Choose the column with the time as well'] } });
    expect(await errorOf({ ...columns, timestampColumn: 'Stamp' })).toMatchObject({ details: { timestampColumn: ['Choose one date-and-time column, or a date column and a time column, not both'] } });
    expect(await errorOf({ ...columns, timeZone: 'Mars/Olympus' })).toMatchObject({ details: { timeZone: ['Choose a time zone from the list (for example Europe/London)'] } });
    expect(await errorOf({ ...columns, dateOrder: 'dym' })).toMatchObject({ details: { dateOrder: ['Choose dmy, mdy or ymd'] } });
    expect(await errorOf({ ...columns, timeColumn: 'date' })).toMatchObject({ details: { timeColumn: ['The same column is already chosen for dateColumn'] } });
  });
});

describe('a mapping used once is offered again', () => {
  const lookup = (agent: Awaited<ReturnType<typeof as>>, infantId: string, headers = HEADERS) =>
    agent.get(`/api/infants/${infantId}/recordings/saved-mapping`).query({ headers });

  it('when a file was read with a mapping, then the same headers (any case) give it back to whoever may upload; others get none', async () => {
    const coord = await as(clinic.people.coordinator.email);
    await uploadRecording(coord, babyId, autumnNight({ hours: 2 }), { ...columns, dateOrder: 'dmy' }).expect(202);
    const nurse = await as(clinic.people.nurse.email);
    expect((await lookup(nurse, babyId, 'date\n TIME \nspo2\npulse').expect(200)).body).toEqual({ mapping: { ...columns, dateOrder: 'dmy', timeFormat: 'auto' } });
    expect((await lookup(nurse, babyId, 'Date\nTime\nSpO2').expect(200)).body).toEqual({ mapping: null });

    // A baby of another programme's: its own programme's mappings only.
    const otherBaby = await enrolledBaby(ctx, other);
    expect((await lookup(await as(other.people.coordinator.email), otherBaby.id).expect(200)).body).toEqual({ mapping: null });
    await lookup(await as(other.people.coordinator.email), babyId).expect(404);
    await lookup(await as((await makeUser(ctx.deps, clinic.programme.id, 'nurse')).email), babyId).expect(404);
    await lookup(await as(clinic.people.consultant.email), babyId).expect(403);
    await lookup(await as(clinic.people.family.email), babyId).expect(403);
    await lookup(await anonymousAgent(ctx.app), babyId).expect(401);
    await lookup(coord, randomUUID()).expect(404);
    await coord.get(`/api/infants/${babyId}/recordings/saved-mapping`).expect(400);
  });

  it('when a file in our own format is uploaded, then no mapping is kept for its headers', async () => {
    const coord = await as(clinic.people.coordinator.email);
    const own = ['timestamp,spo2,pulse', ...Array.from({ length: 60 }, (_, i) => `${i},97,140`)].join('\n');
    await uploadRecording(coord, babyId, own).expect(202);
    expect((await lookup(coord, babyId, 'timestamp\nspo2\npulse').expect(200)).body).toEqual({ mapping: null });
  });
});
