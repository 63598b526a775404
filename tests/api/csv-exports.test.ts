import { randomUUID } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { insertReminder } from '../helpers/reminders';

// The exports of issue 15: caseload, a baby's readings, the message log. Neutralising cells follows OWASP's
// "CSV Injection" advice (prefix a cell starting with = + - @ tab or carriage return with a single quote).
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

type Clinic = Awaited<ReturnType<typeof makeClinic>>;
const BOM = Buffer.from([0xef, 0xbb, 0xbf]);
const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);
const bytes = (t: request.Test) =>
  t.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

/** Downloads an export and reads it back: the raw bytes, the headers and the rows (BOM dropped, first row the headings). */
async function download(agent: Agent, path: string) {
  const res = await bytes(agent.get(path)).expect(200);
  const body = res.body as Buffer;
  const rows: string[][] = parse(body, { bom: true, relax_column_count: false });
  return { res, body, headings: rows[0]!, rows: rows.slice(1), text: body.toString('utf8') };
}

async function enrol(clinic: Clinic, coord: Agent, names: { givenName?: string; familyName?: string } = {}, over: Parameters<typeof enrolmentBody>[1] = {}) {
  const body = enrolmentBody(clinic, over);
  Object.assign(body.baby, names);
  return (await post(coord, '/api/infants', body).expect(201)).body as { id: string; name: string };
}

async function clinicWithCoordinator() {
  const clinic = await makeClinic(ctx.deps);
  return { clinic, coord: await signedInAgent(ctx.app, clinic.people.coordinator.email) };
}

describe('CSV exports: the file itself', () => {
  it('when a coordinator downloads the caseload, then it is UTF-8 text/csv with a byte-order mark, an attachment without a baby name, and headings in words', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    await enrol(clinic, coord, { givenName: 'Zoë', familyName: 'Ørsted' });
    const { res, body, headings, rows } = await download(coord, '/api/infants.csv');
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="caseload-\d{4}-\d{2}-\d{2}\.csv"$/);
    expect(res.headers['content-disposition']).not.toMatch(/Zo|rsted/);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(body.subarray(0, 3).equals(BOM)).toBe(true);
    expect(headings).toEqual(['Baby', 'Date of birth', 'Corrected age', 'Status', 'Flow now (L/min)', 'Home elevation (m)', 'Home air pressure (mmHg)',
      'Nurse', 'Consultant', 'Flags', 'Enrolled (ISO 8601, Europe/London)', 'Nestflow record id']);
    expect(rows).toHaveLength(1);
    expect(rows[0]![0]).toBe('Zoë Ørsted');
    expect(rows[0]![1]).toBe('2026-08-01');
    // ISO 8601 with the offset the instant has in the programme's zone (London: +00:00 or +01:00).
    expect(rows[0]![10]).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\+0[01]:00$/);
    expect(rows[0]![8]).toBe(clinic.people.consultant.name);
  });

  it('when a programme has nobody to list, then the file still has its byte-order mark and headings', async () => {
    const { coord } = await clinicWithCoordinator();
    const { body, headings, rows } = await download(coord, '/api/infants.csv');
    expect(body.subarray(0, 3).equals(BOM)).toBe(true);
    expect(headings[0]).toBe('Baby');
    expect(rows).toEqual([]);
  });
});

describe('CSV exports: neutralising cells a spreadsheet would run (OWASP CSV injection advice)', () => {
  it.each(['=', '+', '-', '@'])('when a baby name starts with %s, then its cell starts with a single quote', async (lead) => {
    const { clinic, coord } = await clinicWithCoordinator();
    await enrol(clinic, coord, { givenName: `${lead}SUM(1+1)`, familyName: 'Cell' });
    const { rows } = await download(coord, '/api/infants.csv');
    expect(rows[0]![0]).toBe(`'${lead}SUM(1+1) Cell`);
  });

  it.each([['tab', '\t'], ['carriage return', '\r']])('when a reading note starts with a %s, then its cell starts with a single quote', async (_name, lead) => {
    const { clinic, coord } = await clinicWithCoordinator();
    const infant = await enrol(clinic, coord);
    const reading = (await post(coord, `/api/infants/${infant.id}/readings`, { takenAt: '2026-11-20T21:00:00Z', spo2: 95, state: 'asleep', notes: 'placeholder' }).expect(201)).body;
    // The contract trims notes, so a leading tab or CR can only come from older or imported data: written directly.
    await ctx.deps.ds.query(`UPDATE readings SET notes = $2 WHERE id = $1`, [reading.id, `${lead}=cmd|' /C calc'!A0`]);
    const { rows, headings } = await download(coord, `/api/infants/${infant.id}/readings.csv`);
    expect(rows[0]![headings.indexOf('Notes')]).toBe(`'${lead}=cmd|' /C calc'!A0`);
  });

  it('when a number is negative, then it stays a number, while text with a genuine leading minus is quoted', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    await enrol(clinic, coord, { givenName: '-Dash', familyName: 'Low' }, { homeElevationM: -20 });
    const { rows, headings } = await download(coord, '/api/infants.csv');
    expect(rows[0]![headings.indexOf('Home elevation (m)')]).toBe('-20');
    expect(rows[0]![0]).toBe("'-Dash Low");
  });

  it('when a cell starts with an ordinary letter, a digit or a quote mark, then it is left as it is', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    await enrol(clinic, coord, { givenName: 'Ada "Addy"', familyName: 'Plain' });
    const { rows } = await download(coord, '/api/infants.csv');
    expect(rows[0]![0]).toBe('Ada "Addy" Plain');
  });
});

describe('CSV exports: the caseload takes the list filters', () => {
  it('when status, search, flag and sort are given, then the file holds exactly the babies the list would, in its order', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const a = await enrol(clinic, coord, { givenName: 'Amber', familyName: 'Ashdown' });
    const b = await enrol(clinic, coord, { givenName: 'Bryony', familyName: 'Ashdown' });
    const c = await enrol(clinic, coord, { givenName: 'Cora', familyName: 'Brack' });
    await ctx.deps.ds.query(`UPDATE infants SET status = 'on_oxygen', flags = '{check_overdue}' WHERE id = ANY($1)`, [[a.id, c.id]]);
    const ids = async (q: string) => (await download(coord, `/api/infants.csv${q}`)).rows.map((r) => r.at(-1));
    expect(await ids('')).toEqual([a.id, b.id, c.id]);
    expect(await ids('?sort=-name')).toEqual([c.id, b.id, a.id]);
    expect(await ids('?q=ashdown')).toEqual([a.id, b.id]);
    expect(await ids('?status=on_oxygen')).toEqual([a.id, c.id]);
    expect(await ids('?flag=check_overdue&q=cora')).toEqual([c.id]);
    // Paging parameters of the list are accepted and ignored: the file is every matching row.
    expect(await ids('?pageSize=1&page=2')).toEqual([a.id, b.id, c.id]);
    const list = (await coord.get('/api/infants?sort=-name&q=ashdown').expect(200)).body.items.map((i: { id: string }) => i.id);
    expect(await ids('?sort=-name&q=ashdown')).toEqual(list);
  });

  it('when more babies match than one page of the export, then each comes exactly once in the sort order', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const first = await enrol(clinic, coord, { givenName: 'Keyset', familyName: 'Clone 0000' });
    // 1,204 copies of the baby made in SQL (enrolling each through the API would take minutes): more than two export pages.
    const cols: Array<{ column_name: string }> = await ctx.deps.ds.query(
      `SELECT column_name FROM information_schema.columns WHERE table_name = 'infants' AND column_name NOT IN ('id', 'enrol_key', 'family_name') ORDER BY ordinal_position`);
    const list = cols.map((c) => c.column_name).join(', ');
    await ctx.deps.ds.query(
      `INSERT INTO infants (${list}, id, enrol_key, family_name) SELECT ${list}, gen_random_uuid(), gen_random_uuid(), 'Clone ' || lpad(g::text, 4, '0') FROM infants, generate_series(1, 1204) g WHERE id = $1`,
      [first.id]);
    const { rows } = await download(coord, '/api/infants.csv?sort=-name');
    expect(rows).toHaveLength(1205);
    expect(new Set(rows.map((r) => r.at(-1))).size).toBe(1205);
    expect(rows[0]![0]).toBe('Keyset Clone 1204');
    expect(rows.at(-1)![0]).toBe('Keyset Clone 0000');
  });
});

describe('CSV exports: rights are the list routes\' rights', () => {
  it('when nobody is signed in, then every export answers 401 in JSON', async () => {
    const anon = await anonymousAgent(ctx.app);
    for (const path of ['/api/infants.csv', `/api/infants/${randomUUID()}/readings.csv`, '/api/messages.csv']) {
      const res = await anon.get(path).expect(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
  });

  it("when another programme's coordinator asks, then our babies are absent from the caseload, our baby's readings are 404 and our messages absent", async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const infant = await enrol(clinic, coord, { givenName: 'Hidden', familyName: 'Away' });
    await insertReminder(ctx.deps, { programmeId: clinic.programme.id, infantId: infant.id, recipientName: 'Parent Hidden' });
    const other = await clinicWithCoordinator();
    expect((await download(other.coord, '/api/infants.csv')).rows).toEqual([]);
    const res = await other.coord.get(`/api/infants/${infant.id}/readings.csv`).expect(404);
    expect(res.body.error.code).toBe('not_found');
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect((await download(other.coord, '/api/messages.csv')).text).not.toContain('Hidden');
  });

  it("when a nurse downloads, then only their caseload comes, the whole programme is refused, and the message log is 403", async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const mine = await enrol(clinic, coord, { givenName: 'Mine', familyName: 'Nursed' });
    const other = await makeClinic(ctx.deps);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    const notMine = await enrol(clinic, coord, { givenName: 'Not', familyName: 'Mine' });
    await ctx.deps.ds.query(`UPDATE infants SET nurse_id = $2 WHERE id = $1`, [notMine.id, other.people.nurse.id]);
    expect((await download(nurse, '/api/infants.csv')).rows.map((r) => r.at(-1))).toEqual([mine.id]);
    expect((await nurse.get('/api/infants.csv?scope=programme').expect(403)).body.error.code).toBe('forbidden');
    expect((await nurse.get(`/api/infants/${notMine.id}/readings.csv`).expect(404)).body.error.code).toBe('not_found');
    expect((await nurse.get('/api/messages.csv').expect(403)).body.error.code).toBe('forbidden');
  });

  it('when the query is bad, then 400 names the fields as the list does', async () => {
    const { coord } = await clinicWithCoordinator();
    expect((await coord.get('/api/infants.csv?sort=shoe&status=lost').expect(400)).body.error.details).toEqual({
      'query.sort': ['Unknown sort'], 'query.status': ['Unknown status'] });
    expect((await coord.get('/api/infants/not-an-id/readings.csv').expect(400)).body.error.details).toEqual({ 'params.id': ['Must be a valid id'] });
    expect(Object.keys((await coord.get('/api/messages.csv?channel=fax').expect(400)).body.error.details)).toEqual(['query.channel']);
  });
});

describe("CSV exports: a baby's readings", () => {
  it('when readings are downloaded, then all of them come oldest first with numbers as numbers and times in the programme zone, and from/to narrow them', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const infant = await enrol(clinic, coord);
    for (const [takenAt, spo2] of [['2026-11-21T06:00:00Z', 93], ['2026-08-15T21:30:00Z', 96], ['2026-11-20T23:15:00Z', 94]] as const) {
      await post(coord, `/api/infants/${infant.id}/readings`, { takenAt, spo2, pulse: 140, flowLpm: 0.25, state: 'asleep' }).expect(201);
    }
    const { headings, rows, res } = await download(coord, `/api/infants/${infant.id}/readings.csv`);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="readings-${infant.id}.csv"`);
    expect(headings.slice(0, 6)).toEqual(['Taken at (ISO 8601, Europe/London)', 'SpO2 (%)', 'Pulse (/min)', 'Flow (L/min)', 'State', 'Weight (kg)']);
    // London is UTC+1 in summer (BST) and UTC+0 in winter: the offset is the one the instant had there.
    expect(rows.map((r) => r.slice(0, 5))).toEqual([
      ['2026-08-15T22:30:00+01:00', '96', '140', '0.25', 'Asleep'],
      ['2026-11-20T23:15:00+00:00', '94', '140', '0.25', 'Asleep'],
      ['2026-11-21T06:00:00+00:00', '93', '140', '0.25', 'Asleep'],
    ]);
    const narrowed = await download(coord, `/api/infants/${infant.id}/readings.csv?from=2026-11-01T00:00:00Z&to=2026-11-21T00:00:00Z`);
    expect(narrowed.rows.map((r) => r[1])).toEqual(['94']);
  });

  it('when a baby has more readings than one export page, then each comes exactly once, in time order', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const infant = await enrol(clinic, coord);
    // 1,101 readings, made in SQL, with pairs sharing a time so the id has to break the tie across page ends.
    await ctx.deps.ds.query(
      `INSERT INTO readings (programme_id, infant_id, taken_at, spo2, state, family_reported, created_by)
       SELECT $2, $1, timestamptz '2026-10-01 00:00:00Z' + ((g / 2) || ' minutes')::interval, 90 + g % 10, 'awake', false, $3 FROM generate_series(0, 1100) g`,
      [infant.id, clinic.programme.id, clinic.people.coordinator.id]);
    const { rows } = await download(coord, `/api/infants/${infant.id}/readings.csv`);
    expect(rows).toHaveLength(1101);
    expect(new Set(rows.map((r) => r.at(-1))).size).toBe(1101);
    const times = rows.map((r) => Date.parse(r[0]!));
    expect(times).toEqual([...times].sort((x, y) => x - y));
  });
});

describe('CSV exports: the message log', () => {
  it('when the log filters, search and sort are given, then the file holds what the list holds, in its order, across export pages', async () => {
    const { clinic, coord } = await clinicWithCoordinator();
    const infant = await enrol(clinic, coord, { givenName: 'Maple', familyName: 'Moss' });
    const at = (min: number) => new Date(Date.parse('2026-11-20T08:00:00Z') + min * 60_000);
    const failed = await insertReminder(ctx.deps, { programmeId: clinic.programme.id, infantId: infant.id, status: 'failed', sendAt: at(1), recipientName: 'Rowan Moss' });
    const sent = await insertReminder(ctx.deps, { programmeId: clinic.programme.id, infantId: infant.id, status: 'sent', sendAt: at(2), recipientName: 'Ivy Moss' });
    // 1,050 more, half of them due at the same instant, so the keyset's id tie-break is crossed at page ends.
    await ctx.deps.ds.query(
      `INSERT INTO reminders (programme_id, template, recipient_name, channel, to_address, time_zone, dedupe_key, send_at, status)
       SELECT $1, 'nurse-digest', 'Staff ' || g, 'email', 'staff' || g || '@test.example', 'Europe/London', 'csv-' || gen_random_uuid(),
              timestamptz '2026-11-01 07:00:00Z' + ((g % 2) * g || ' minutes')::interval, CASE WHEN g % 3 = 0 THEN 'sent' ELSE 'scheduled' END
         FROM generate_series(1, 1050) g`, [clinic.programme.id]);
    const ids = async (q: string) => (await download(coord, `/api/messages.csv${q}`)).rows.map((r) => r.at(-1));
    expect(await ids('?q=moss')).toEqual([sent, failed]);
    expect(await ids('?q=moss&sort=sendAt')).toEqual([failed, sent]);
    expect(await ids('?q=rowan')).toEqual([failed]);
    expect(await ids(`?infantId=${infant.id}&status=sent`)).toEqual([sent]);
    for (const sort of ['-sendAt', 'sendAt', 'status', '-status']) {
      const all = await ids(`?sort=${sort}`);
      expect(all).toHaveLength(1052);
      expect(new Set(all).size).toBe(1052);
      // The list's first page in the same sort starts the same way (ties aside: status sorts by time within a status).
      const page = (await coord.get(`/api/messages?sort=${sort}&pageSize=100`).expect(200)).body.items.map((m: { id: string; sendAt: string; status: string }) => `${m.status} ${m.sendAt}`);
      const file = (await download(coord, `/api/messages.csv?sort=${sort}`)).rows.slice(0, 100).map((r) => r);
      expect(file.map((r) => `${r[2]!.toLowerCase().replace('outcome unknown', 'unknown')} ${new Date(r[0]!).toISOString()}`)).toEqual(page);
    }
    // An E.164 number is text starting with +, so it is quoted like any other: the spreadsheet shows +44…, not 447….
    const { headings, rows } = await download(coord, `/api/messages.csv?status=failed&q=maple`);
    expect(headings).toContain('Due to send (ISO 8601, Europe/London)');
    expect(rows).toEqual([[
      '2026-11-20T08:01:00+00:00', '', 'Failed', '', 'Visit tomorrow (family)', 'SMS', 'Rowan Moss', 'Family', "'+447700900001", 'Maple Moss', '1',
      'Provider said no', expect.stringMatching(/^\d{4}-\d{2}-\d{2}T/), failed,
    ]]);
  });
});
