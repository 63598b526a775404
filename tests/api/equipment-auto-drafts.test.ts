import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { approvedBaby, post } from '../helpers/approved-baby';
import { mailTo } from '../helpers/account-mail';
import { SUPPLIER_EMAIL, supplierToken, withSupplier } from '../helpers/equipment';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock('2026-12-01T10:00:00Z') });
});
afterAll(() => ctx.close());

// As in tests/api/monitoring.test.ts: the step-down rules are not met minutes after approval, so the nurse and the
// consultant give reasons; the rules themselves are tested elsewhere. Here only the equipment that follows matters.
const ANYWAY = { overrideReason: 'Walking the ladder for the test; rules checked elsewhere' };
const APPROVE = { decision: 'approve', reason: 'Approved despite the unmet rules for this test' };

type Order = { purpose: string; status: string; automaticReason: string | null; items: Array<Record<string, unknown>>; history: Array<{ by: string }> };

/** A baby at home with a concentrator for flowMin–flowMax L/min and two static cylinders, delivered through the link. */
async function babyWithEquipment(flowMinLpm: number, flowMaxLpm: number) {
  const baby = await approvedBaby(ctx.deps, ctx.app);
  await withSupplier(ctx.deps, baby.clinic.programme.id);
  const items = [{ kind: 'concentrator', quantity: 1, flowMinLpm, flowMaxLpm }, { kind: 'static_cylinder', quantity: 2, size: 'large-home' }, { kind: 'spares', quantity: 1 }];
  const made = (await post(baby.coord, `/api/infants/${baby.infant.id}/equipment-orders`, { items, neededBy: '2026-12-04' }).expect(201)).body.order;
  const token = supplierToken(await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`${made.reference} from ${baby.clinic.programme.name}`)));
  await request(ctx.app).post(`/supplier-api/orders/${token}/confirm`).send({ deliveryOn: '2026-12-03' }).expect(200);
  await request(ctx.app).post(`/supplier-api/orders/${token}/delivered`).send({}).expect(200);
  const nurse = await signedInAgent(ctx.app, baby.clinic.people.nurse.email);
  const orders = async (): Promise<Order[]> => (await baby.coord.get(`/api/infants/${baby.infant.id}/equipment-orders`).expect(200)).body.items;
  const stepDown = async () => {
    const next = (await post(nurse, `/api/infants/${baby.infant.id}/step-down-requests`, { reason: 'Settled', ...ANYWAY }).expect(201)).body;
    await post(baby.consultant, `/api/prescriptions/${next.id}/decision`, APPROVE).expect(200);
    return next;
  };
  return { ...baby, orders, stepDown };
}

describe('orders Nestflow drafts by itself', () => {
  it('when a newly approved flow is still inside the installed concentrator’s range, then nothing is drafted', async () => {
    const { orders, stepDown } = await babyWithEquipment(0.1, 2);
    await stepDown();
    expect((await orders()).map((o) => o.purpose)).toEqual(['delivery']);
  });

  it('when a newly approved flow falls outside the installed concentrator’s range, then a change is drafted (not sent) for the coordinator', async () => {
    const { orders, stepDown, infant } = await babyWithEquipment(0.5, 2);
    const next = await stepDown();
    const [change] = await orders();
    expect(change).toMatchObject({ purpose: 'change', status: 'drafted' });
    expect(change.items).toEqual([{ kind: 'concentrator', quantity: 1, flowMinLpm: next.proposedFlowLpm, flowMaxLpm: next.proposedFlowLpm }]);
    expect(change.automaticReason).toContain('outside the installed concentrator\'s range 0.5–2 L/min');
    expect(change.history[0].by).toBe('Nestflow');
    // One open change draft at a time: the next approval outside the range adds none.
    await stepDown();
    expect((await orders()).filter((o) => o.purpose === 'change')).toHaveLength(1);
    const audit = (await ctx.deps.repos.audit.listForEntity('infant', infant.id)).filter((e) => e.action === 'equipment_order.drafted');
    expect(audit.some((e) => e.actorId === null && e.details.automatic === true)).toBe(true);
  });

  it('when a change is drafted, then "needed by" counts from today where the programme is, not in UTC', async () => {
    const { orders, stepDown, clinic } = await babyWithEquipment(0.5, 2);
    // The clock says 2026-12-01 10:00 UTC: already 2 December at UTC+14.
    await ctx.deps.ds.query(`UPDATE programmes SET time_zone = 'Pacific/Kiritimati' WHERE id = $1`, [clinic.programme.id]);
    await stepDown();
    const [change] = await orders();
    expect(change).toMatchObject({ purpose: 'change', neededBy: '2026-12-04' });
  });

  it('when the baby comes off oxygen, then the collection of what is at home is drafted (spares stay with the family)', async () => {
    // A range from 0 keeps every rung of the ladder inside it, so only coming off oxygen drafts anything.
    const { orders, stepDown, infant, coord } = await babyWithEquipment(0, 2);
    // Walk the ladder to "off": lower steps, then night-only, then off (as tests/api/monitoring.test.ts does).
    for (let i = 0; i < 30 && (await stepDown()).proposedFlowLpm !== 0; i++) expect((await orders()).map((o) => o.purpose)).toEqual(['delivery']);
    expect((await coord.get(`/api/infants/${infant.id}`).expect(200)).body.status).toBe('off_oxygen');
    const [collection] = await orders();
    expect(collection).toMatchObject({ purpose: 'collection', status: 'drafted' });
    expect(collection.items.map((i) => i.kind)).toEqual(['concentrator', 'static_cylinder']);
    expect(collection.automaticReason).toMatch(/^The baby came off oxygen/);
  });

  it('when a baby has no delivered equipment, then an approval drafts nothing', async () => {
    const baby = await approvedBaby(ctx.deps, ctx.app);
    expect((await baby.coord.get(`/api/infants/${baby.infant.id}/equipment-orders`).expect(200)).body.items).toEqual([]);
  });
});
