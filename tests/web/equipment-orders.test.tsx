import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import type { EquipmentOrder, SupplierOrderView } from '@shared/schemas/equipment-orders';
import type { InfantDetail } from '@shared/schemas/infants';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import { apiError, json, PROGRAMME_ID, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

const ID = '7a7a7a7a-0000-4000-8000-000000000001';
const infant: InfantDetail = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Cindermoor', location: { elevationM: 1780 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 1780, homePressureMmHg: 614.2, activeFlowLpm: null, activeSetting: null, status: 'preparing', flags: [],
  nurse: null, consultant: null, contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
};

const policy = {
  programmeId: PROGRAMME_ID, version: 4, createdAt: null,
  settings: { ...DEFAULT_POLICY_SETTINGS, supplier: { name: 'Fenwold Medical Gases', orderEmail: 'orders@fenwold.example', phone: '+441632960002', lendsOximeter: false } },
};

const order = (over: Partial<EquipmentOrder>): EquipmentOrder => ({
  id: 'c1c1c1c1-0000-4000-8000-000000000001', infantId: ID, infantName: 'Ashdown, Juniper', reference: 'EQ-00001', purpose: 'delivery', status: 'sent',
  items: [{ kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 2 }, { kind: 'static_cylinder', quantity: 2, size: 'large-home' }],
  neededBy: '2025-04-10', deliveryAddress: '4 Kiln Lane, Cindermoor', note: null, supplierEmail: 'orders@fenwold.example', deliveryOn: null, deliveredAt: null,
  failureReason: null, automaticReason: null, flags: ['unconfirmed_by_needed_date'],
  history: [
    { status: 'drafted', at: '2025-04-02T09:00:00.000Z', by: 'Tobias Fenwick', note: null },
    { status: 'sent', at: '2025-04-02T09:00:01.000Z', by: 'Tobias Fenwick', note: 'to orders@fenwold.example' },
  ],
  createdAt: '2025-04-02T09:00:00.000Z', ...over,
});

function stubRecord(role: Role, orders: EquipmentOrder[], posts: FakeRequest[] = []) {
  stubApi({
    'GET /api/session': sessionHandler(role),
    [`GET /api/infants/${ID}`]: () => json(200, infant),
    [`GET /api/infants/${ID}/prescriptions`]: () => json(200, { items: [] }),
    [`GET /api/infants/${ID}/audit`]: () => json(200, { items: [], people: {} }),
    [`GET /api/infants/${ID}/equipment-orders`]: () => json(200, { items: orders }),
    'GET /api/policy': () => json(200, policy),
    'GET /api/users': () => json(200, { items: [], total: 0 }),
    [`POST /api/infants/${ID}/equipment-orders`]: (request) => {
      posts.push(request);
      return json(201, { order: order({ reference: 'EQ-00002', id: 'c1c1c1c1-0000-4000-8000-000000000002', flags: [] }) });
    },
  });
}

const equipment = async () => screen.findByRole('heading', { level: 2, name: 'Equipment' }).then((h) => h.closest('section') as HTMLElement);

describe('the Equipment section of a baby’s record', () => {
  it('when orders exist, then the coordinator sees each status, its flags and history, and the delivered ones folded away', async () => {
    stubRecord('coordinator', [order({}), order({ id: 'c1c1c1c1-0000-4000-8000-000000000003', reference: 'EQ-00003', status: 'delivered', flags: [], deliveryOn: '2025-04-05', deliveredAt: '2025-04-05T11:00:00.000Z' })]);
    renderApp(`/infants/${ID}`);
    const section = await equipment();
    const open = await within(section).findByRole('list', { name: 'Open equipment orders' });
    const first = within(open).getByRole('listitem', { name: 'Order EQ-00001' });
    expect(within(first).getByText('Sent, waiting for the supplier')).toBeInTheDocument();
    expect(within(first).getByText('Not confirmed by the date needed')).toBeInTheDocument();
    expect(within(first).getByText('1 × Oxygen concentrator, flow range 0.1–2 L/min')).toBeInTheDocument();
    expect(within(first).getByText('2 × Static cylinders, Large home cylinder (1360 L at 137 bar)')).toBeInTheDocument();
    expect(within(first).getByText(/Sent, waiting for the supplier \(Tobias Fenwick\) — to orders@fenwold.example/)).toBeInTheDocument();
    expect(within(first).getByRole('button', { name: 'Cancel EQ-00001' })).toBeInTheDocument();
    expect(within(first).queryByRole('button', { name: /^Send/ })).toBeNull();
    expect(within(section).getByText('Delivered and cancelled orders (1)')).toBeInTheDocument();
  });

  it('when the coordinator orders equipment, then the form checks the fields and sends the order as the API takes it', async () => {
    const posts: FakeRequest[] = [];
    stubRecord('coordinator', [], posts);
    const { user } = renderApp(`/infants/${ID}`);
    const section = await equipment();
    await user.click(await within(section).findByRole('button', { name: 'Order equipment' }));
    const form = within(section).getByRole('form', { name: 'Order equipment' });
    await user.click(within(form).getByRole('button', { name: 'Send to the supplier' }));
    const summary = await within(form).findByRole('region', { name: 'There is a problem' });
    expect(within(summary).getByRole('link', { name: /Needed by/ })).toBeInTheDocument();
    expect(within(summary).getByRole('link', { name: /Lowest flow/ })).toBeInTheDocument();
    expect(posts).toHaveLength(0);

    await user.type(within(form).getByLabelText('Lowest flow, L/min (item 1)'), '0.1');
    await user.type(within(form).getByLabelText('Highest flow, L/min (item 1)'), '1');
    await user.click(within(form).getByRole('button', { name: 'Add an item' }));
    await user.selectOptions(within(form).getByLabelText('Item 2'), 'portable_cylinder');
    await user.clear(within(form).getByLabelText('How many (item 2)'));
    await user.type(within(form).getByLabelText('How many (item 2)'), '4');
    await user.selectOptions(within(form).getByLabelText('Cylinder size (item 2)'), 'small-portable');
    await user.type(within(form).getByLabelText('Needed by'), '2025-04-10');
    await user.click(within(form).getByRole('button', { name: 'Send to the supplier' }));
    await waitFor(() => expect(posts).toHaveLength(1));
    expect(posts[0].body).toEqual({
      purpose: 'delivery', neededBy: '2025-04-10', send: true,
      items: [{ kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 1 }, { kind: 'portable_cylinder', quantity: 4, size: 'small-portable' }],
    });
    expect(await screen.findByText('Order EQ-00002 sent to the supplier.')).toBeInTheDocument();
  }, 30_000);

  it('when a nurse opens the record, then the orders show without the buttons to order, send or cancel', async () => {
    stubRecord('nurse', [order({ status: 'drafted', flags: [] })]);
    renderApp(`/infants/${ID}`);
    const section = await equipment();
    await within(section).findByRole('listitem', { name: 'Order EQ-00001' });
    expect(within(section).queryByRole('button')).toBeNull();
  });
});

const view = (over: Partial<SupplierOrderView> = {}): SupplierOrderView => ({
  reference: 'EQ-00001', purpose: 'delivery', status: 'sent', neededBy: '2025-04-10', deliveryAddress: '4 Kiln Lane\nCindermoor', recipient: 'The Ashdown family',
  note: null, deliveryOn: null, deliveredAt: null, linkExpiresAt: '2025-04-24T23:59:59.000Z',
  items: [{ kind: 'concentrator', label: 'Oxygen concentrator', quantity: 1, detail: 'flow range 0.1–2 L/min', note: null }],
  programme: { name: 'Larkmoor Home Oxygen', phone: '01632 960001', phoneDial: '+441632960001' }, ...over,
});

describe('the supplier’s page', () => {
  const TOKEN = 'c1c1c1c1-0000-4000-8000-000000000001.1745539199.abc';
  it('when the supplier opens the link, then they confirm a date and later the delivery, with no session', async () => {
    const calls: FakeRequest[] = [];
    const fetchMock = stubApi({
      [`GET /supplier-api/orders/${TOKEN}`]: () => json(200, { order: view() }),
      [`POST /supplier-api/orders/${TOKEN}/confirm`]: (request) => {
        calls.push(request);
        return json(200, { order: view({ status: 'confirmed', deliveryOn: '2025-04-09' }) });
      },
      [`POST /supplier-api/orders/${TOKEN}/delivered`]: (request) => {
        calls.push(request);
        return json(200, { order: view({ status: 'delivered', deliveryOn: '2025-04-09', deliveredAt: '2025-04-09T10:00:00.000Z' }) });
      },
    });
    const { user } = renderApp(`/supplier/orders/${TOKEN}`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Equipment order EQ-00001' })).toBeInTheDocument();
    expect(screen.getByText('1 × Oxygen concentrator, flow range 0.1–2 L/min')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: '01632 960001' })).toHaveAttribute('href', 'tel:+441632960001');
    expect(screen.queryByText(/Juniper/)).toBeNull();
    await user.type(screen.getByLabelText('Delivery date'), '2025-04-09');
    await user.click(screen.getByRole('button', { name: 'Confirm the delivery date' }));
    expect(await screen.findByText('Delivery date confirmed')).toBeInTheDocument();
    expect(calls[0].body).toEqual({ deliveryOn: '2025-04-09' });
    await user.click(screen.getByRole('button', { name: 'Mark as delivered' }));
    expect(await screen.findByText('Delivered', { selector: 'p' })).toBeInTheDocument();
    expect(calls).toHaveLength(2);
    expect(fetchMock.mock.calls.map(([url]) => String(url)).some((url) => url.includes('/api/'))).toBe(false);
  });

  it('when the link is not valid, then the page says so in words and shows no order', async () => {
    stubApi({ [`GET /supplier-api/orders/${TOKEN}`]: () => apiError(404, 'link_expired', 'This link has expired. Please call the home oxygen team for a new one.') });
    renderApp(`/supplier/orders/${TOKEN}`);
    expect(await screen.findByRole('alert')).toHaveTextContent('This link has expired. Please call the home oxygen team for a new one.');
    expect(screen.queryByText(/EQ-/)).toBeNull();
  });
});
