import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { auditWords } from '@shared/audit/audit-words';
import { infantOrdersSchema, orderAnswerSchema, ordersPageSchema } from '@shared/schemas/equipment-orders';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { approvedBaby, post } from '../helpers/approved-baby';
import { makeClinic } from '../helpers/infants';
import { mailTo, mailsTo } from '../helpers/account-mail';
import { SUPPLIER_EMAIL, supplierToken, withSupplier } from '../helpers/equipment';
import { pdfAttachment, pdfLinks, pdfText } from '../helpers/pdf';

// Every time-dependent decision here runs on an injected clock: the order's flags and the link's expiry.
const NOW = '2026-12-01T10:00:00Z';
let ctx: TestContext;
let later: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
  // The same database two days after the supplier link of an order needed on 5 Dec stopped working (5 + 14 days).
  later = await createTestContext({}, { clock: fixedClock('2026-12-20T00:00:00Z') });
});
afterAll(async () => {
  await ctx.close();
  await later.close();
});

const CONCENTRATOR = { kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 2 };
const order = (over: Record<string, unknown> = {}) => ({
  items: [CONCENTRATOR, { kind: 'static_cylinder', quantity: 2, size: 'large-home' }, { kind: 'portable_cylinder', quantity: 4, size: 'small-portable' },
    { kind: 'spares', quantity: 2, note: 'Size 0 cannulas' }],
  neededBy: '2026-12-05',
  ...over,
});

async function babyWithSupplier(over: Parameters<typeof withSupplier>[2] = {}) {
  const baby = await approvedBaby(ctx.deps, ctx.app);
  await withSupplier(ctx.deps, baby.clinic.programme.id, over);
  return baby;
}

const supplier = (token: string) => ({
  get: () => request(ctx.app).get(`/supplier-api/orders/${token}`),
  confirm: (deliveryOn: string) => request(ctx.app).post(`/supplier-api/orders/${token}/confirm`).send({ deliveryOn }),
  delivered: () => request(ctx.app).post(`/supplier-api/orders/${token}/delivered`).send({}),
});

describe('POST /api/infants/:id/equipment-orders', () => {
  it('when the coordinator orders and sends, then 201 "sent" and the supplier gets an e-mail with the order as a PDF and a link', async () => {
    const { infant, coord, clinic } = await babyWithSupplier();
    const res = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order()).expect(201);
    expect(orderAnswerSchema.safeParse(res.body).error).toBeUndefined();
    expect(res.body.order).toMatchObject({ status: 'sent', reference: 'EQ-00001', deliveryAddress: '1 Test Row, Cindermoor' });
    const mail = await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`EQ-00001 from ${clinic.programme.name}`));
    expect(mail.subject).toBe(`Equipment order EQ-00001 from ${clinic.programme.name}: needed by 5 Dec 2026`);
    const link = /http:\/\/nestflow\.test\/supplier\/orders\/[A-Za-z0-9._-]+/.exec(mail.text)?.[0];
    expect(link, 'the signed link in the mail').toBeDefined();
    const pdf = pdfAttachment(mail);
    expect(pdf?.subarray(0, 8).toString()).toBe('%PDF-1.7');
    const text = await pdfText(pdf!);
    // The same link in the PDF: printed (it may wrap, so compared without the white space) and clickable as a whole.
    expect(text.replace(/\s/g, '')).toContain(link);
    expect(pdfLinks(pdf!)).toEqual([link]);
    expect(text).toContain('Equipment order EQ-00001');
    expect(text).toContain('5 Dec 2026');
    expect(text).toContain(`The ${infant.familyName} family`);
    expect(text).toContain('1 × Oxygen concentrator, flow range 0.1–2 L/min');
    expect(text).toContain('2 × Static cylinders, Large home cylinder (1360 L at 137 bar)');
    expect(text).toContain('4 × Portable cylinders, Small portable (460 L at 230 bar)');
    // The supplier needs no diagnosis and no first name.
    expect(text).not.toContain(`${infant.givenName} ${infant.familyName}`);
    expect(text).not.toMatch(/lung|diagnos/i);
    const audit = (await coord.get(`/api/infants/${infant.id}/audit`).expect(200)).body.items.map((e: { action: string }) => e.action);
    expect(audit).toEqual(expect.arrayContaining(['equipment_order.drafted', 'equipment_order.sent']));
    const second = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ send: false })).expect(201);
    expect(second.body.order.reference).toBe('EQ-00002');
  });

  it('when send is false, then the order is drafted and nothing is e-mailed until the coordinator sends it', async () => {
    const { infant, coord, clinic } = await babyWithSupplier();
    const before = mailsTo(ctx.mail, SUPPLIER_EMAIL).length;
    const res = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ send: false, deliveryAddress: '4 Gull Lane\nHarrowby' })).expect(201);
    expect(res.body.order).toMatchObject({ status: 'drafted', deliveryAddress: '4 Gull Lane\nHarrowby' });
    expect(mailsTo(ctx.mail, SUPPLIER_EMAIL).length).toBe(before);
    const sent = await post(coord, `/api/equipment-orders/${res.body.order.id}/send`, {}).expect(200);
    expect(orderAnswerSchema.safeParse(sent.body).error).toBeUndefined();
    expect(sent.body.order.status).toBe('sent');
    expect(sent.body.order.history.map((h: { status: string }) => h.status)).toEqual(['drafted', 'sent']);
    await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`${res.body.order.reference} from ${clinic.programme.name}`));
    await post(coord, `/api/equipment-orders/${res.body.order.id}/send`, {}).expect(409);
  });

  it('when the items are wrong, then 400 with a message per field and nothing stored', async () => {
    const { infant, coord } = await babyWithSupplier();
    const res = await post(coord, `/api/infants/${infant.id}/equipment-orders`, {
      items: [{ kind: 'concentrator', quantity: 1, flowMinLpm: 2, flowMaxLpm: 1 }, { kind: 'static_cylinder', quantity: 0 }], neededBy: '5 Dec',
    }).expect(400);
    expect(Object.keys(res.body.error.details)).toEqual(expect.arrayContaining(['items.0.flowMaxLpm', 'items.1.quantity', 'items.1.size', 'neededBy']));
    const unknown = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ items: [{ kind: 'static_cylinder', quantity: 1, size: 'huge' }, { kind: 'oximeter', quantity: 1 }] })).expect(400);
    expect(unknown.body.error.details).toMatchObject({ 'items.0.size': [expect.any(String)], 'items.1.kind': ['The programme does not lend oximeters (programme settings)'] });
    const past = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ neededBy: '2026-11-30' })).expect(400);
    expect(past.body.error.details).toEqual({ neededBy: ['The date needed cannot be in the past'] });
    expect((await coord.get(`/api/infants/${infant.id}/equipment-orders`).expect(200)).body.items).toEqual([]);
  });

  it('when the programme lends oximeters, then one may be ordered', async () => {
    const { infant, coord } = await babyWithSupplier({ lendsOximeter: true });
    await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ items: [{ kind: 'oximeter', quantity: 1 }], send: false })).expect(201);
  });

  it('when the programme has no supplier address, then the order is kept as failed with the reason and flagged', async () => {
    const { infant, coord } = await babyWithSupplier({ orderEmail: '' });
    const res = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order()).expect(201);
    expect(res.body.order).toMatchObject({ status: 'failed', failureReason: 'The programme settings have no supplier order address', flags: expect.arrayContaining(['send_failed']) });
    const list = (await coord.get('/api/equipment-orders?status=failed').expect(200)).body.items;
    expect(list.map((o: { id: string }) => o.id)).toEqual([res.body.order.id]);
    const audit = (await coord.get(`/api/infants/${infant.id}/audit`).expect(200)).body.items;
    const failed = audit.find((e: { action: string }) => e.action === 'equipment_order.send_failed');
    expect(auditWords(failed.action, failed.details)).toMatch(/^Equipment order EQ-\d{5} could not be sent: The programme settings have no supplier order address$/);
  });
});

describe('a refused e-mail', () => {
  it('when the mail service refuses the order, then it stays failed with the reason, flagged, and sending again delivers it', async () => {
    const { infant, coord, clinic } = await babyWithSupplier();
    // The fake's failure switch: the next transaction is refused with a permanent 550.
    await fetch(`http://127.0.0.1:${ctx.mail.httpPort}/fail`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: '4xx', count: 1 }) });
    const res = await post(coord, `/api/infants/${infant.id}/equipment-orders`, order()).expect(201);
    expect(res.body.order).toMatchObject({ status: 'failed', flags: ['send_failed'], failureReason: expect.stringMatching(/^Mail rejected: .*550/) });
    expect(res.body.order.history.map((h: { status: string }) => h.status)).toEqual(['drafted', 'failed']);
    const again = await post(coord, `/api/equipment-orders/${res.body.order.id}/send`, {}).expect(200);
    expect(again.body.order).toMatchObject({ status: 'sent', flags: [], failureReason: null });
    await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`${res.body.order.reference} from ${clinic.programme.name}`));
  });
});

describe('who may do what', () => {
  it('when a nurse or consultant reads, then they see the orders; only the coordinator creates, sends and cancels; the family sees nothing', async () => {
    const { infant, coord, consultant, family, clinic } = await babyWithSupplier();
    const made = (await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ send: false })).expect(201)).body.order;
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const forNurse = (await nurse.get(`/api/infants/${infant.id}/equipment-orders`).expect(200)).body;
    expect(infantOrdersSchema.safeParse(forNurse).error).toBeUndefined();
    expect(forNurse.items).toHaveLength(1);
    expect((await consultant.get(`/api/infants/${infant.id}/equipment-orders`).expect(200)).body.items).toHaveLength(1);
    const page = (await admin.get('/api/equipment-orders').expect(200)).body;
    expect(ordersPageSchema.safeParse(page).error).toBeUndefined();
    expect(page.items).toHaveLength(1);
    await nurse.get('/api/equipment-orders').expect(403);
    for (const agent of [nurse, consultant, admin]) {
      await post(agent, `/api/infants/${infant.id}/equipment-orders`, order()).expect(403);
      await post(agent, `/api/equipment-orders/${made.id}/send`, {}).expect(403);
      await post(agent, `/api/equipment-orders/${made.id}/cancel`, { reason: 'No longer needed' }).expect(403);
    }
    await family.get(`/api/infants/${infant.id}/equipment-orders`).expect(403);
    await family.get('/api/equipment-orders').expect(403);
    // Nor the supplier's address through the programme's settings, which the family reads for its targets and numbers.
    const policy = (await family.get('/api/policy').expect(200)).body;
    expect(policy.settings.supplier).toEqual({ name: '', orderEmail: '', phone: '', lendsOximeter: false });
    expect(policy.settings.discharge.items).toEqual([]);
    expect((await coord.get('/api/policy').expect(200)).body.settings.supplier.orderEmail).not.toBe('');
  });

  it('when another programme’s coordinator tries, then 404 for the baby and the order, and their list is empty', async () => {
    const { infant, coord } = await babyWithSupplier();
    const made = (await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ send: false })).expect(201)).body.order;
    const other = await makeClinic(ctx.deps);
    const stranger = await signedInAgent(ctx.app, other.people.coordinator.email);
    await post(stranger, `/api/infants/${infant.id}/equipment-orders`, order()).expect(404);
    await stranger.get(`/api/infants/${infant.id}/equipment-orders`).expect(404);
    await post(stranger, `/api/equipment-orders/${made.id}/send`, {}).expect(404);
    await post(stranger, `/api/equipment-orders/${made.id}/cancel`, { reason: 'Mine now' }).expect(404);
    expect((await stranger.get('/api/equipment-orders').expect(200)).body.items).toEqual([]);
  });
});

describe('the supplier’s signed link', () => {
  async function sentOrder() {
    const baby = await babyWithSupplier();
    const made = (await post(baby.coord, `/api/infants/${baby.infant.id}/equipment-orders`, order()).expect(201)).body.order;
    const token = supplierToken(await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`${made.reference} from ${baby.clinic.programme.name}`)));
    return { ...baby, made, token };
  }

  it('when the supplier opens it, then only what a delivery needs is shown, with no session and nothing cached', async () => {
    const { token, infant } = await sentOrder();
    const res = await supplier(token).get().expect(200);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(Object.keys(res.body.order).sort()).toEqual(['deliveredAt', 'deliveryAddress', 'deliveryOn', 'items', 'linkExpiresAt', 'neededBy', 'note', 'programme', 'purpose', 'recipient', 'reference', 'status']);
    expect(res.body.order).toMatchObject({ status: 'sent', recipient: `The ${infant.familyName} family`, neededBy: '2026-12-05', linkExpiresAt: '2026-12-19T23:59:59.000Z',
      programme: { phone: '01632 960001', phoneDial: '+441632960001' } });
    expect(JSON.stringify(res.body)).not.toMatch(/lung|diagnos|spo2|birth/i);
  });

  it('when the supplier sends a broken body or a bad date, then 400 with the reason and nothing changes', async () => {
    const { token } = await sentOrder();
    const broken = await request(ctx.app).post(`/supplier-api/orders/${token}/confirm`).set('Content-Type', 'application/json').send('{"deliveryOn":').expect(400);
    expect(broken.body.error.requestId).toBeDefined();
    expect((await supplier(token).confirm('4 Dec').expect(400)).body.error.details).toEqual({ deliveryOn: ['Use a date like 2026-12-03'] });
    await request(ctx.app).post(`/supplier-api/orders/${token}/confirm`).send({ deliveryOn: '2026-12-04', extra: 1 }).expect(400);
    expect((await supplier(token).get().expect(200)).body.order.status).toBe('sent');
  });

  it('when the link is tampered with, signed for another order, or expired, then a readable refusal and no order data', async () => {
    const a = await sentOrder();
    const b = await sentOrder();
    const [id, exp, sig] = a.token.split('.');
    const tampered = [`${id}.${Number(exp) + 86_400}.${sig}`, `${b.made.id}.${exp}.${sig}`, `${id}.${exp}.${sig.slice(0, -1)}${sig.endsWith('A') ? 'B' : 'A'}`, 'nonsense'];
    for (const token of tampered) {
      const res = await supplier(token).get().expect(404);
      expect(res.body.error).toMatchObject({ code: 'link_invalid', message: expect.stringContaining('not valid') });
      expect(JSON.stringify(res.body)).not.toContain(a.made.reference);
      await supplier(token).confirm('2026-12-04').expect(404);
    }
    const expired = await request(later.app).get(`/supplier-api/orders/${a.token}`).expect(404);
    expect(expired.body.error).toMatchObject({ code: 'link_expired', message: expect.stringContaining('expired') });
    await request(later.app).post(`/supplier-api/orders/${a.token}/confirm`).send({ deliveryOn: '2026-12-21' }).expect(404);
    // Each link opens its own order only.
    expect((await supplier(b.token).get().expect(200)).body.order.reference).toBe(b.made.reference);
  });

  it('when the supplier confirms a date and then the delivery, then the coordinator sees each status with who changed it, audited', async () => {
    const { token, made, coord, infant } = await sentOrder();
    await supplier(token).delivered().expect(409);
    await supplier(token).confirm('2026-11-30').expect(400);
    // A date after the one needed is taken, and flagged for the coordinator until a better one comes.
    await supplier(token).confirm('2026-12-08').expect(200);
    expect((await coord.get(`/api/infants/${infant.id}/equipment-orders`).expect(200)).body.items[0].flags).toEqual(['delivery_after_needed_date']);
    expect((await supplier(token).confirm('2026-12-04').expect(200)).body.order).toMatchObject({ status: 'confirmed', deliveryOn: '2026-12-04' });
    expect((await supplier(token).delivered().expect(200)).body.order).toMatchObject({ status: 'delivered', deliveredAt: NOW.replace('Z', '.000Z') });
    await supplier(token).confirm('2026-12-06').expect(409);
    const [seen] = (await coord.get(`/api/infants/${infant.id}/equipment-orders`).expect(200)).body.items;
    expect(seen).toMatchObject({ id: made.id, status: 'delivered', deliveryOn: '2026-12-04', flags: [] });
    expect(seen.history.map((h: { status: string; by: string }) => [h.status, h.by])).toEqual([
      ['drafted', expect.stringMatching(/^Test coordinator/)], ['sent', expect.stringMatching(/^Test coordinator/)], ['confirmed', 'Supplier'], ['confirmed', 'Supplier'],
      ['delivered', 'Supplier'],
    ]);
    const audit = (await coord.get(`/api/infants/${infant.id}/audit`).expect(200)).body.items;
    const confirmed = audit.find((e: { action: string }) => e.action === 'equipment_order.confirmed');
    expect(confirmed.actor).toBeNull();
    expect(auditWords(confirmed.action, confirmed.details)).toBe(`The supplier confirmed delivery of order ${made.reference} for Fri, 4 Dec 2026 (was Tue, 8 Dec 2026)`);
    expect(audit.map((e: { action: string }) => e.action)).toContain('equipment_order.delivered');
  });

  it('when the coordinator cancels a sent order, then the supplier is told and the link shows it cancelled', async () => {
    const { token, made, coord, clinic } = await sentOrder();
    await post(coord, `/api/equipment-orders/${made.id}/cancel`, { reason: 'x' }).expect(400);
    expect((await post(coord, `/api/equipment-orders/${made.id}/cancel`, { reason: 'Discharge postponed' }).expect(200)).body.order.status).toBe('cancelled');
    await mailTo(ctx.mail, SUPPLIER_EMAIL, new RegExp(`^Cancelled: order ${made.reference} from ${clinic.programme.name}`));
    expect((await supplier(token).get().expect(200)).body.order.status).toBe('cancelled');
    await supplier(token).confirm('2026-12-04').expect(409);
    await post(coord, `/api/equipment-orders/${made.id}/cancel`, { reason: 'Again' }).expect(409);
  });
});

describe('flags and the programme list', () => {
  it('when an order is not confirmed by the date needed (on the injected clock), then it is flagged and listed as overdue', async () => {
    const { infant, coord } = await babyWithSupplier();
    const due = (await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ neededBy: '2026-12-01' })).expect(201)).body.order;
    const notYet = (await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ neededBy: '2026-12-02' })).expect(201)).body.order;
    expect(due.flags).toEqual(['unconfirmed_by_needed_date']);
    expect(notYet.flags).toEqual([]);
    const overdue = (await coord.get('/api/equipment-orders?status=overdue').expect(200)).body.items.map((o: { id: string }) => o.id);
    expect(overdue).toContain(due.id);
    expect(overdue).not.toContain(notYet.id);
    const overview = (await coord.get('/api/overview').expect(200)).body;
    expect(overview.equipmentOrders).toEqual({ failed: 0, unconfirmed: 1 });
  });

  it('when the list is longer than a page, then the next pages follow without repeats', async () => {
    const { infant, coord } = await babyWithSupplier();
    for (let n = 0; n < 5; n++) await post(coord, `/api/infants/${infant.id}/equipment-orders`, order({ send: false })).expect(201);
    const seen: string[] = [];
    let next: string | null = null;
    do {
      const page: { items: Array<{ reference: string }>; next: string | null } = (await coord.get('/api/equipment-orders').query({ pageSize: 2, ...(next ? { after: next } : {}) }).expect(200)).body;
      seen.push(...page.items.map((o: { reference: string }) => o.reference));
      next = page.next;
    } while (next);
    expect(seen).toEqual(['EQ-00005', 'EQ-00004', 'EQ-00003', 'EQ-00002', 'EQ-00001']);
    await coord.get('/api/equipment-orders?after=garbage').expect(400);
  });
});
