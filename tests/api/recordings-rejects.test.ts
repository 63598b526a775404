import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';
import { enrolledBaby, storedFor, uploadRecording } from '../fixtures/recordings/upload';

let ctx: TestContext;
let coord: Agent;
let babyId: string;
beforeAll(async () => {
  ctx = await createTestContext();
  const clinic = await makeClinic(ctx.deps);
  babyId = (await enrolledBaby(ctx, clinic)).id;
  coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
});
afterAll(() => ctx.close());

const good = csvFromSamples(steadySamples(120));
const lines = (n: number, row: (i: number) => string) => ['timestamp,spo2,pulse', ...Array.from({ length: n }, (_, i) => row(i))].join('\n') + '\n';

describe('POST /api/infants/:id/recordings: files that are refused', () => {
  it('when the file is empty or blank, then 400 empty_file', async () => {
    expect((await uploadRecording(coord, babyId, '').expect(400)).body.error.code).toBe('empty_file');
    expect((await uploadRecording(coord, babyId, '\uFEFF\n \n').expect(400)).body.error.code).toBe('empty_file');
  });

  it('when a binary file is renamed .csv, or the text is not UTF-8, then 415 not_csv', async () => {
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), Buffer.from(good)]);
    const res = await uploadRecording(coord, babyId, png, {}, 'night.csv').expect(415);
    expect(res.body.error).toMatchObject({ code: 'not_csv', message: expect.stringMatching(/not a CSV text file/) });
    const latin1 = Buffer.from(good.replace('timestamp', 'timestamp'.padEnd(10, 'é')), 'latin1');
    expect((await uploadRecording(coord, babyId, latin1).expect(415)).body.error.code).toBe('not_csv');
    const utf16 = Buffer.from(`\uFEFF${good}`, 'utf16le');
    expect((await uploadRecording(coord, babyId, utf16).expect(415)).body.error.code).toBe('not_csv');
  });

  it('when the CSV is malformed (unclosed quote, ragged row), then 400 malformed_csv naming the line', async () => {
    const quoteOnLine6 = good.split('\n').map((l, i) => (i === 5 ? `"${l}` : l)).join('\n');
    const unclosed = await uploadRecording(coord, babyId, quoteOnLine6).expect(400);
    expect(unclosed.body.error).toMatchObject({ code: 'malformed_csv', details: { line: ['6'] } });
    expect(unclosed.body.error.message).toMatch(/Line 6: a quoted value is never closed/);
    const ragged = good.split('\n').map((l, i) => (i === 41 ? `${l},extra` : l)).join('\n');
    const res = await uploadRecording(coord, babyId, ragged).expect(400);
    expect(res.body.error).toMatchObject({ code: 'malformed_csv', message: 'The file is not valid CSV. Line 42 has 5 values but the header has 4.' });
  });

  it('when too many timestamps cannot be read, then 400 unreadable_rows says which line', async () => {
    const res = await uploadRecording(coord, babyId, lines(100, (i) => (i === 7 || i === 8 ? `20:00:0${i},97,140` : `${i},97,140`))).expect(400);
    expect(res.body.error).toMatchObject({ code: 'unreadable_rows', details: { line: ['9'], lines: ['line 9: time "20:00:07" is not a number of seconds', 'line 10: time "20:00:08" is not a number of seconds'] } });
  });

  it('when there are fewer than 60 samples, or the night spans more than 26 h, then 400 too_short / too_long', async () => {
    expect((await uploadRecording(coord, babyId, lines(59, (i) => `${i},97,140`)).expect(400)).body.error.code).toBe('too_short');
    const long = await uploadRecording(coord, babyId, lines(60, (i) => `${i * 1800},97,140`)).expect(400);
    expect(long.body.error).toMatchObject({ code: 'too_long', message: expect.stringMatching(/spans 30\.0 hours; one upload may span at most 26 hours/) });
  });

  it('when the file is 50 MB, then 413 too_large with a readable message', async () => {
    const row = '2026-11-20T20:00:00.000Z,97,140,ok\n';
    const big = Buffer.alloc(50 * 1024 * 1024, row);
    const res = await uploadRecording(coord, babyId, big).expect(413);
    expect(res.body.error).toMatchObject({ code: 'too_large', message: expect.stringMatching(/larger than 20 MB/) });
  });

  it('when the form is wrong (not multipart, no file, two files, unknown or bad fields), then 415 or 400', async () => {
    const url = `/api/infants/${babyId}/recordings`;
    expect((await coord.post(url).set('X-CSRF-Token', coord.csrf).send({ file: good }).expect(415)).body.error.code).toBe('not_multipart');
    expect((await coord.post(url).set('X-CSRF-Token', coord.csrf).field('timeFormat', 'iso').expect(400)).body.error.code).toBe('no_file');
    const two = coord.post(url).set('X-CSRF-Token', coord.csrf).attach('file', Buffer.from(good), 'a.csv').attach('file', Buffer.from(good), 'b.csv');
    expect((await two.expect(400)).body.error.code).toBe('bad_form');
    const elsewhere = coord.post(url).set('X-CSRF-Token', coord.csrf).attach('upload', Buffer.from(good), 'a.csv');
    expect((await elsewhere.expect(400)).body.error.code).toBe('bad_form');
    const fields = await uploadRecording(coord, babyId, good, { timeFormat: 'minutes', notes: 'x' }).expect(400);
    expect(fields.body.error).toMatchObject({ code: 'validation_failed', details: { timeFormat: [expect.any(String)], _: ['Unknown field(s): notes'] } });
  });

  it('when every refusal above has been answered, then nothing was stored for the baby: no recording, samples or audit entry', async () => {
    expect(await storedFor(ctx, babyId)).toEqual({ recordings: 0, samples: 0, audits: 0 });
    await uploadRecording(coord, babyId, good).expect(202);
    expect(await storedFor(ctx, babyId)).toEqual({ recordings: 1, samples: 1, audits: 1 });
  });
});
