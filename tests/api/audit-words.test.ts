import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditWords } from '@shared/audit/audit-words';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);
// A visit far enough ahead for any run of the suite; only its stored words are checked.
const DAY = '2099-03-10';

describe("the baby's audit trail", () => {
  it('when a visit is moved to another nurse and cancelled, then the trail names the nurses and the day, and every line reads in words', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const infant = (await post(coord, '/api/infants', enrolmentBody(clinic, {})).expect(201)).body;
    const other = await makeUser(ctx.deps, clinic.programme.id, 'nurse');
    const visit = (await post(coord, `/api/infants/${infant.id}/visits`, { kind: 'home_visit', date: DAY, time: '10:00', durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Weight' }).expect(201)).body;
    const moved = (await coord.patch(`/api/visits/${visit.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: visit.rowVersion, time: '14:30', staffId: other.id }).expect(200)).body;
    await post(coord, `/api/visits/${moved.id}/cancel`, { reason: 'Family away' }).expect(200);

    const audit = (await coord.get(`/api/infants/${infant.id}/audit`).expect(200)).body;
    expect(audit.people).toEqual({ [clinic.people.nurse.id]: clinic.people.nurse.name, [other.id]: other.name });
    const lines = audit.items.map((e: { action: string; details: Record<string, unknown> }) => auditWords(e.action, e.details, audit.people));
    expect(lines).toContain(`Moved a visit from Tue, 10 Mar 2099 at 10:00 to Tue, 10 Mar 2099 at 14:30; now with ${other.name} (was ${clinic.people.nurse.name})`);
    expect(lines).toContain('Cancelled a visit for Tue, 10 Mar 2099 at 14:30: Family away');
    for (const [i, line] of lines.entries()) expect(line).not.toContain(audit.items[i].action);
  });
});
