import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { DEFAULT_DISCHARGE_RULES } from '@shared/schemas/discharge-policy';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { approvedBaby, post } from '../helpers/approved-baby';
import { mailTo } from '../helpers/account-mail';
import { put, tickAll } from '../helpers/discharge';
import { SUPPLIER_EMAIL, supplierToken, withSupplier } from '../helpers/equipment';

// The checklist's equipment items follow the baby's equipment orders (shared/discharge/order-ticks.ts); every
// date here comes from this injected instant: the day sent, the day delivered, "today" for the discharge date.
const NOW = '2026-12-01T10:00:00Z';
const TODAY = '2026-12-01';
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(() => ctx.close());

const ORDER = { items: [{ kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 2 }, { kind: 'static_cylinder', quantity: 2, size: 'large-home' }], neededBy: '2026-12-05' };
const EQUIPMENT = ['equipment_ordered', 'equipment_installed'];
type Item = { key: string; done: boolean; doneBy: unknown; doneAt: string | null; note: string; byOrder: unknown; evidence: unknown };

async function baby() {
  const b = await approvedBaby(ctx.deps, ctx.app);
  await withSupplier(ctx.deps, b.clinic.programme.id);
  const checklist = async () => (await b.coord.get(`/api/infants/${b.infant.id}/discharge`).expect(200)).body as { items: Item[]; ready: boolean; missing: string[] };
  const item = async (key: string) => (await checklist()).items.find((i) => i.key === key)!;
  const order = async (over: Record<string, unknown> = {}) =>
    (await post(b.coord, `/api/infants/${b.infant.id}/equipment-orders`, { ...ORDER, ...over }).expect(201)).body.order as { id: string; reference: string; status: string };
  const linkOf = async (reference: string) => {
    const token = supplierToken(await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`${reference} from ${b.clinic.programme.name}`)));
    return {
      confirm: (deliveryOn: string) => request(ctx.app).post(`/supplier-api/orders/${token}/confirm`).send({ deliveryOn }).expect(200),
      delivered: () => request(ctx.app).post(`/supplier-api/orders/${token}/delivered`).send({}).expect(200),
    };
  };
  return { ...b, checklist, item, order, linkOf };
}

describe('the equipment items follow the baby\'s orders', () => {
  it('when an order is sent, then the ordered item is done by it; when the supplier delivers, the installed item is done; readiness counts both', async () => {
    const b = await baby();
    expect((await b.checklist()).missing).toEqual(expect.arrayContaining(EQUIPMENT));
    const made = await b.order();
    const ordered = await b.item('equipment_ordered');
    expect(ordered).toMatchObject({ done: true, doneBy: null, doneAt: NOW.replace('Z', '.000Z'), byOrder: { event: 'sent', orderId: made.id, reference: made.reference, status: 'sent', on: TODAY } });
    expect(await b.item('equipment_installed')).toMatchObject({ done: false, byOrder: null });

    const link = await b.linkOf(made.reference);
    await link.confirm('2026-12-04');
    // Confirmed is still not installed; the ordered item now shows the order's newer status.
    expect(await b.item('equipment_ordered')).toMatchObject({ done: true, byOrder: { event: 'sent', status: 'confirmed' } });
    expect((await b.item('equipment_installed')).done).toBe(false);
    await link.delivered();
    expect(await b.item('equipment_installed')).toMatchObject({
      done: true, doneBy: null, doneAt: NOW.replace('Z', '.000Z'), evidence: { date: TODAY }, byOrder: { event: 'delivered', orderId: made.id, status: 'delivered', on: TODAY },
    });

    // Everything else by hand: the baby is ready without anyone ticking the equipment items.
    await tickAll(b.coord, b.infant.id, EQUIPMENT);
    expect(await b.checklist()).toMatchObject({ ready: true, missing: [] });
    const overview = (await b.coord.get('/api/overview').expect(200)).body.discharges.babies.find((x: { infantId: string }) => x.infantId === b.infant.id);
    expect(overview.missing).toEqual([]);
    expect((await post(b.coord, `/api/infants/${b.infant.id}/discharge`, { date: '2026-12-08' }).expect(200)).body).toMatchObject({ dischargedOn: '2026-12-08' });
    // The family still sees nothing about equipment or orders.
    expect(JSON.stringify((await b.family.get(`/api/infants/${b.infant.id}/discharge`).expect(200)).body)).not.toMatch(/order|equipment_ordered|equipment_installed/i);
  });

  it('when the delivery comes after the discharge date being set, then the installed item is missing and the date is refused', async () => {
    const b = await baby();
    const made = await b.order();
    const link = await b.linkOf(made.reference);
    await link.confirm(TODAY);
    await link.delivered();
    await tickAll(b.coord, b.infant.id, EQUIPMENT);
    // Delivered on 1 Dec (the clock): a discharge on 30 Nov would have gone home before the equipment.
    const refused = await post(b.coord, `/api/infants/${b.infant.id}/discharge`, { date: '2026-11-30' }).expect(422);
    expect(refused.body.error).toMatchObject({ code: 'discharge_not_ready', details: { missing: ['equipment_installed'] } });
    // On the day of the delivery it counts.
    await post(b.coord, `/api/infants/${b.infant.id}/discharge`, { date: TODAY }).expect(200);
    expect((await b.item('equipment_installed')).byOrder).toMatchObject({ on: TODAY });
  });

  it('when the order is only drafted, is cancelled, or is a collection, then it does not tick anything', async () => {
    const b = await baby();
    await b.order({ send: false });
    expect((await b.item('equipment_ordered')).done).toBe(false);
    const sent = await b.order();
    expect((await b.item('equipment_ordered')).done).toBe(true);
    await post(b.coord, `/api/equipment-orders/${sent.id}/cancel`, { reason: 'Discharge postponed' }).expect(200);
    expect(await b.item('equipment_ordered')).toMatchObject({ done: false, byOrder: null });
    await b.order({ purpose: 'collection' });
    expect((await b.checklist()).missing).toEqual(expect.arrayContaining(EQUIPMENT));
  });

  it('when the equipment came another way, then a hand tick with a note still counts, and stands before an order’s', async () => {
    const b = await baby();
    const rule = DEFAULT_DISCHARGE_RULES.items.find((r) => r.key === 'equipment_installed')!;
    expect(rule.evidence).toEqual(['date']);
    const res = await put(b.coord, `/api/infants/${b.infant.id}/discharge/items/equipment_installed`, {
      done: true, note: 'Transferred from the previous programme', evidence: { date: '2026-11-29' },
    }).expect(200);
    expect(res.body).toMatchObject({ done: true, byOrder: null, note: 'Transferred from the previous programme', doneBy: { id: b.clinic.people.coordinator.id } });
    // A later order does not replace who ticked it; unticking by hand hands the item back to the orders.
    await b.order();
    expect(await b.item('equipment_installed')).toMatchObject({ done: true, byOrder: null, evidence: { date: '2026-11-29' } });
    expect((await b.item('equipment_ordered')).byOrder).not.toBeNull();
    await put(b.coord, `/api/infants/${b.infant.id}/discharge/items/equipment_installed`, { done: false }).expect(200);
    expect(await b.item('equipment_installed')).toMatchObject({ done: false, byOrder: null, note: 'Transferred from the previous programme' });
  });
});
