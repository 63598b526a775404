import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { Role } from '@shared/auth/roles';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Discharge, DischargeItem } from '@shared/schemas/discharge';
import { DEFAULT_DISCHARGE_RULES } from '@shared/schemas/discharge-policy';
import { apiError, json, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

vi.mock('../../web/features/charts/components/uplot-chart', () => ({ default: () => <div data-testid="uplot-chart" /> }));

const ID = '7a7a7a7a-0000-4000-8000-000000000061';
const nurse = sessionUser('nurse');
const coordinator = sessionUser('coordinator');

const infant: InfantDetail = {
  id: ID, name: 'Ottoline Marsh', givenName: 'Ottoline', familyName: 'Marsh', sex: 'female', birthDate: '2026-08-10',
  gestation: { weeks: 28, days: 1 }, correctedAge: '4 wk', postmenstrualAge: '44+0 wk', chronologicalAge: '16 wk',
  birthWeightG: 1010, weightKg: 2.9, weightDate: '2026-11-28', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.25, source: 'cylinder', o2Percent: 100 },
  home: { address: '9 Weir Cottages, Larkmoor', location: { elevationM: 120 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 120, homePressureMmHg: 749.5, activeFlowLpm: 0.25, status: 'on_oxygen', flags: [], activeSetting: null,
  nurse: { id: nurse.id, name: nurse.name }, consultant: null, contacts: [], rowVersion: 1, enrolledAt: '2026-11-20T09:00:00.000Z',
};

const items = (done: readonly string[] = []): DischargeItem[] => DEFAULT_DISCHARGE_RULES.items.map((r) => ({
  key: r.key, label: r.label, group: r.group, evidenceNeeded: [...r.evidence], source: r.source, done: done.includes(r.key),
  doneBy: done.includes(r.key) ? { id: coordinator.id, name: 'Petra Quill' } : null, doneAt: done.includes(r.key) ? '2026-12-01T10:00:00.000Z' : null,
  note: '', evidence: null, byOrder: null,
}));
const discharge = (over: Partial<Discharge> = {}): Discharge => {
  const list = over.items ?? items();
  const missing = list.filter((i) => !i.done).map((i) => i.key);
  return { items: list, ready: missing.length === 0, missing, settingApproved: true, dischargedOn: null, override: null, firstVisit: null, ...over };
};

type Handler = (request: FakeRequest) => Response;
function stubRecord(role: Role, state: { current: Discharge }, extra: Record<string, Handler> = {}) {
  stubApi({
    'GET /api/session': sessionHandler(role),
    [`GET /api/infants/${ID}`]: () => json(200, infant),
    [`GET /api/infants/${ID}/prescriptions`]: () => json(200, { items: [] }),
    [`GET /api/infants/${ID}/visits`]: () => json(200, { items: [] }),
    [`GET /api/infants/${ID}/discharge`]: () => json(200, state.current),
    'GET /api/users': () => json(200, { items: [], total: 0, page: 1, pageSize: 100 }),
    ...extra,
  });
}
const card = async () => (await screen.findByRole('heading', { name: 'Discharge' }, { timeout: 5000 })).closest('section') as HTMLElement;

describe('Infant record: discharge', () => {
  it('when part is done, then progress, groups with counts, who ticked and the letter link show', async () => {
    stubRecord('coordinator', { current: discharge({ items: items(['equipment_use', 'no_smoking']) }) });
    renderApp(`/infants/${ID}`);
    const section = await card();
    expect(await within(section).findByText(`2 of ${DEFAULT_DISCHARGE_RULES.items.length} steps done`)).toBeInTheDocument();
    expect(within(section).getByRole('heading', { name: 'Family training (1 of 5)' })).toBeInTheDocument();
    expect(within(section).getByRole('heading', { name: 'Letters (0 of 2)' })).toBeInTheDocument();
    expect(within(section).getAllByText(/^Done by Petra Quill, 1 Dec 2026/)).toHaveLength(2);
    expect(within(section).getByRole('link', { name: 'Download the discharge letter (PDF)' })).toHaveAttribute('href', `/api/infants/${ID}/discharge-letter.pdf`);
  });

  it('when the baby has left the programme, then the checklist reads as a record: no date to set, nothing to tick or undo', async () => {
    stubRecord('coordinator', { current: discharge({ items: items(['equipment_use']) }) }, {
      [`GET /api/infants/${ID}`]: () => json(200, { ...infant, status: 'left_programme', activeFlowLpm: null }),
    });
    renderApp(`/infants/${ID}`);
    const section = await card();
    expect(await within(section).findByText('This baby has left the programme: the checklist is closed and kept as it was.')).toBeInTheDocument();
    // Not "getting ready to go home": the baby has left.
    expect(within(section).getByText('No discharge date was set here')).toBeInTheDocument();
    expect(within(section).queryByText('Getting ready to go home')).toBeNull();
    expect(within(section).getByText(`1 of ${DEFAULT_DISCHARGE_RULES.items.length} steps done`)).toBeInTheDocument();
    expect(within(section).queryByRole('button', { name: /discharge date/ })).toBeNull();
    expect(within(section).queryByRole('button', { name: /^Mark done:|^Undo:/ })).toBeNull();
    expect(within(section).getByRole('link', { name: 'Download the discharge letter (PDF)' })).toBeInTheDocument();
  });

  it('when the supplier’s delivery did the equipment items, then they say so with a link to the order and offer no undo', async () => {
    const ORDER_ID = '7a7a7a7a-0000-4000-8000-000000000001';
    const list = items().map((i) => (i.key === 'equipment_installed'
      ? { ...i, done: true, doneAt: '2026-12-04T14:00:00.000Z', evidence: { date: '2026-12-04' }, byOrder: { event: 'delivered' as const, orderId: ORDER_ID, reference: 'LHO-0007', status: 'delivered' as const, on: '2026-12-04' } }
      : i));
    stubRecord('coordinator', { current: discharge({ items: list }) }, { [`GET /api/infants/${ID}/equipment-orders`]: () => json(200, { items: [] }) });
    renderApp(`/infants/${ID}`);
    const section = await card();
    expect(await within(section).findByText(/Done by the supplier’s delivery, on 4 Dec 2026/)).toBeInTheDocument();
    expect(within(section).getByRole('link', { name: 'order LHO-0007' })).toHaveAttribute('href', `#order-${ORDER_ID}`);
    expect(within(section).queryByRole('button', { name: /Undo: Equipment installed/ })).toBeNull();
    // The item not yet done by an order can still be ticked by hand (equipment that came another way).
    expect(within(section).getByRole('button', { name: 'Mark done: Equipment ordered from the supplier' })).toBeInTheDocument();
  });

  it('when evidence is missing, then the API’s messages sit beside the fields; once given, the tick is saved with it', async () => {
    const state = { current: discharge() };
    const bodies: unknown[] = [];
    stubRecord('coordinator', state, {
      [`PUT /api/infants/${ID}/discharge/items/home_assessment`]: ({ body }) => {
        bodies.push(body);
        const b = body as { evidence?: { date?: string; person?: string } };
        if (!b.evidence?.person) return apiError(400, 'validation_failed', 'Some fields need attention.', { 'evidence.person': ['Say who did it'], 'evidence.date': ['Enter the date it was done'] });
        const item = { ...state.current.items.find((i) => i.key === 'home_assessment')!, done: true, doneBy: { id: coordinator.id, name: 'Petra Quill' }, doneAt: '2026-12-03T10:00:00.000Z', evidence: b.evidence };
        state.current = discharge({ items: state.current.items.map((i) => (i.key === item.key ? item : i)) });
        return json(200, item);
      },
    });
    const user = userEvent.setup();
    renderApp(`/infants/${ID}`);
    const section = await card();
    await user.click(await within(section).findByRole('button', { name: 'Mark done: Home assessed for oxygen safety' }));
    const form = within(section).getByRole('form', { name: 'Mark done: Home assessed for oxygen safety' });
    await user.click(within(form).getByRole('button', { name: 'Save as done' }));
    expect(await within(form).findAllByText('Say who did it')).not.toHaveLength(0);
    expect(within(form).getByLabelText('Who did it')).toHaveAttribute('aria-invalid', 'true');
    await user.type(within(form).getByLabelText('Date it was done'), '2026-12-01');
    await user.type(within(form).getByLabelText('Who did it'), 'Tamsin Reed');
    await user.click(within(form).getByRole('button', { name: 'Save as done' }));
    await waitFor(() => expect(within(section).queryByRole('form', { name: 'Mark done: Home assessed for oxygen safety' })).toBeNull());
    expect(bodies.at(-1)).toEqual({ done: true, note: '', evidence: { date: '2026-12-01', person: 'Tamsin Reed' } });
    expect(await within(section).findByText(/Done by Petra Quill, .* · evidence: 1 Dec 2026, Tamsin Reed/)).toBeInTheDocument();
  });

  it('when the coordinator sets a date too early, then the 422 names each missing step in words and there is no override box', async () => {
    stubRecord('coordinator', { current: discharge({ items: items(DEFAULT_DISCHARGE_RULES.items.map((i) => i.key).filter((k) => k !== 'smoke_alarms')) }) }, {
      [`POST /api/infants/${ID}/discharge`]: () =>
        json(422, { error: { code: 'discharge_not_ready', message: 'The baby is not ready to go home: some steps are not done.', details: { missing: ['setting_approved', 'smoke_alarms'] }, requestId: 'r1' } }),
    });
    const user = userEvent.setup();
    renderApp(`/infants/${ID}`);
    const section = await card();
    await user.click(await within(section).findByRole('button', { name: 'Set discharge date' }));
    const form = within(section).getByRole('form', { name: 'Set discharge date' });
    expect(within(form).queryByLabelText(/Reason to set the date/)).toBeNull();
    await user.type(within(form).getByLabelText('Discharge date'), '2026-12-08');
    await user.click(within(form).getByRole('button', { name: 'Save the discharge date' }));
    expect(await within(form).findByText('Not ready to go home. Still to do: Setting approved by a consultant; Working smoke alarms in the home.')).toBeInTheDocument();
  });

  it('when a consultant overrides, then the reason is sent and the record shows the date, the override and the proposed first visit', async () => {
    const state = { current: discharge({ items: items(['equipment_use']) }) };
    const bodies: unknown[] = [];
    stubRecord('consultant', state, {
      [`POST /api/infants/${ID}/discharge`]: ({ body }) => {
        bodies.push(body);
        state.current = { ...state.current, dischargedOn: '2026-12-08', override: { reason: 'Family moving to the coast', by: { id: sessionUser('consultant').id, name: 'Dr Ilse Varga' }, missing: ['smoke_alarms'] }, firstVisit: { proposedOn: '2026-12-09', bookedVisitId: null, visitOn: null } };
        return json(200, state.current);
      },
    });
    const user = userEvent.setup();
    renderApp(`/infants/${ID}`);
    const section = await card();
    await user.click(await within(section).findByRole('button', { name: 'Set discharge date' }));
    const form = within(section).getByRole('form', { name: 'Set discharge date' });
    await user.type(within(form).getByLabelText('Discharge date'), '2026-12-08');
    await user.type(within(form).getByLabelText('Reason to set the date before every step is done'), 'Family moving to the coast');
    await user.click(within(form).getByRole('button', { name: 'Save the discharge date' }));
    expect(await within(section).findByText('Discharge date: 8 Dec 2026')).toBeInTheDocument();
    expect(bodies).toEqual([{ date: '2026-12-08', overrideReason: 'Family moving to the coast' }]);
    expect(within(section).getByText(/Date set by Dr Ilse Varga before every step was done \(Working smoke alarms in the home\)/)).toBeInTheDocument();
    expect(within(section).getByText('First home visit proposed for 9 Dec 2026: not booked yet.')).toBeInTheDocument();
    // A consultant does not book visits.
    expect(within(section).queryByRole('button', { name: 'Book the first home visit' })).toBeNull();
  });

  it('when the first visit is proposed, then the coordinator books it from the proposal: a home visit that day, for the first visit', async () => {
    stubRecord('coordinator', { current: discharge({ items: items(DEFAULT_DISCHARGE_RULES.items.map((i) => i.key)), dischargedOn: '2026-12-08', firstVisit: { proposedOn: '2026-12-09', bookedVisitId: null, visitOn: null } }) });
    const user = userEvent.setup();
    renderApp(`/infants/${ID}`);
    const section = await card();
    await user.click(await within(section).findByRole('button', { name: 'Book the first home visit' }));
    const booking = within(section).getByRole('form', { name: 'Book a visit' });
    expect(within(booking).getByLabelText('Kind of visit')).toHaveValue('home_visit');
    expect(within(booking).getByLabelText('Date')).toHaveValue('2026-12-09');
    expect(within(booking).getByLabelText('What it is for')).toHaveValue('First home visit after discharge');
  });

  it('when the first visit is booked on another day than proposed, then the card gives the booked day and offers no second booking', async () => {
    stubRecord('coordinator', { current: discharge({ items: items(DEFAULT_DISCHARGE_RULES.items.map((i) => i.key)), dischargedOn: '2026-12-08', firstVisit: { proposedOn: '2026-12-09', bookedVisitId: '6f6f6f6f-0000-4000-8000-000000000001', visitOn: '2026-12-11' } }) });
    renderApp(`/infants/${ID}`);
    const section = await card();
    expect(await within(section).findByText('First home visit booked for 11 Dec 2026 (proposed for 9 Dec 2026).')).toBeInTheDocument();
    expect(within(section).queryByRole('button', { name: 'Book the first home visit' })).toBeNull();
  });

  it('when the letter is e-mailed, then a bad address is refused beside the box and a good one is confirmed', async () => {
    const bodies: unknown[] = [];
    stubRecord('coordinator', { current: discharge() }, {
      [`POST /api/infants/${ID}/discharge-letter/email`]: ({ body }) => {
        bodies.push(body);
        const to = (body as { to: string }).to;
        if (!to.includes('@')) return apiError(400, 'validation_failed', 'Some fields need attention.', { to: ['Enter an e-mail address like gp@example.org'] });
        return json(200, { sentTo: to, filename: 'discharge-letter-ottoline-marsh-2026-12-03.pdf' });
      },
    });
    const user = userEvent.setup();
    renderApp(`/infants/${ID}`);
    const section = await card();
    const form = await within(section).findByRole('form', { name: 'E-mail the discharge letter' });
    await user.type(within(form).getByLabelText('E-mail the letter to'), 'surgery');
    await user.click(within(form).getByRole('button', { name: 'E-mail the letter' }));
    expect(await within(form).findAllByText('Enter an e-mail address like gp@example.org')).not.toHaveLength(0);
    await user.clear(within(form).getByLabelText('E-mail the letter to'));
    await user.type(within(form).getByLabelText('E-mail the letter to'), 'surgery@larkmoor.example');
    await user.click(within(form).getByRole('button', { name: 'E-mail the letter' }));
    expect(await within(form).findByText('Letter sent to surgery@larkmoor.example.')).toBeInTheDocument();
    expect(bodies).toEqual([{ to: 'surgery' }, { to: 'surgery@larkmoor.example' }]);
  });
});
