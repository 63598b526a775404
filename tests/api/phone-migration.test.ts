import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PhoneNumbersE1641765584000000 } from '../../server/db/migrations/1765584000000-PhoneNumbersE164';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

async function babyWithMobile(mobile: string) {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic)).expect(201)).body;
  // As stored before numbers were read: whatever was typed.
  await ctx.deps.ds.query(`UPDATE family_contacts SET mobile = $2 WHERE infant_id = $1`, [infant.id, mobile]);
  return { clinic, coord, infant };
}
const state = async (infantId: string) => {
  const [c] = await ctx.deps.ds.query(`SELECT mobile FROM family_contacts WHERE infant_id = $1`, [infantId]);
  const [i] = await ctx.deps.ds.query(`SELECT flags FROM infants WHERE id = $1`, [infantId]);
  return { mobile: c.mobile as string, flagged: (i.flags as string[]).includes('number_unreadable') };
};
async function migrate(direction: 'up' | 'down') {
  const runner = ctx.deps.ds.createQueryRunner();
  try {
    await new PhoneNumbersE1641765584000000()[direction](runner);
  } finally {
    await runner.release();
  }
}

describe('moving stored family numbers to E.164', () => {
  it('when numbers were stored as typed, then readable mobiles become E.164, unreadable ones stay as they were and flag the baby for the coordinator', async () => {
    const national = await babyWithMobile('07700 900111');
    const spaced = await babyWithMobile('+44 7700 900 112');
    const garbled = await babyWithMobile('7700-900');
    const landline = await babyWithMobile('020 7946 0123');
    await migrate('up');
    expect(await state(national.infant.id)).toEqual({ mobile: '+447700900111', flagged: false });
    expect(await state(spaced.infant.id)).toEqual({ mobile: '+447700900112', flagged: false });
    expect(await state(garbled.infant.id)).toEqual({ mobile: '7700-900', flagged: true });
    expect(await state(landline.infant.id)).toEqual({ mobile: '020 7946 0123', flagged: true });

    // The coordinator's list: the caseload filtered by the flag.
    const list = (await garbled.coord.get('/api/infants?flag=number_unreadable').expect(200)).body.items.map((i: { id: string }) => i.id);
    expect(list).toEqual([garbled.infant.id]);

    // A second run changes nothing and does not flag twice; down removes only the flag.
    await migrate('up');
    const [{ flags }] = await ctx.deps.ds.query(`SELECT flags FROM infants WHERE id = $1`, [garbled.infant.id]);
    expect(flags.filter((f: string) => f === 'number_unreadable')).toHaveLength(1);
    await migrate('down');
    expect(await state(garbled.infant.id)).toEqual({ mobile: '7700-900', flagged: false });
    expect(await state(national.infant.id)).toEqual({ mobile: '+447700900111', flagged: false });
  });

  it('when the coordinator saves the contacts with a readable number, then the flag goes', async () => {
    const { coord, infant } = await babyWithMobile('7700-900');
    await migrate('up');
    expect((await state(infant.id)).flagged).toBe(true);
    const detail = (await coord.get(`/api/infants/${infant.id}`).expect(200)).body;
    const contacts = detail.contacts.map(({ id: _id, mobile: _m, email, ...rest }: Record<string, unknown>) => ({ ...rest, email: email ?? '', mobile: '07700 900333' }));
    await coord.put(`/api/infants/${infant.id}/contacts`).set('X-CSRF-Token', coord.csrf).send({ contacts }).expect(200);
    expect(await state(infant.id)).toEqual({ mobile: '+447700900333', flagged: false });
  });
});
