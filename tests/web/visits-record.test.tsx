import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { Role } from '@shared/auth/roles';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Visit } from '@shared/schemas/visits';
import { apiError, json, makeUser, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

vi.mock('../../web/features/charts/components/uplot-chart', () => ({ default: () => <div data-testid="uplot-chart" /> }));

const ID = '7a7a7a7a-0000-4000-8000-000000000041';
const nurse = sessionUser('nurse');
const tobias = makeUser({ name: 'Tobias Fenwright', role: 'nurse' });

const infant: InfantDetail = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Wrenbrook', location: { elevationM: 610 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 610, homePressureMmHg: 705.1, activeFlowLpm: 0.25, status: 'on_oxygen', flags: [], activeSetting: null,
  nurse: { id: nurse.id, name: nurse.name }, consultant: null, contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
};

const visit = (overrides: Partial<Visit> = {}): Visit => ({
  id: 'f1f1f1f1-0000-4000-8000-000000000041', infantId: ID, kind: 'home_visit', startsAt: '2037-12-03T10:00:00.000Z',
  date: '2037-12-03', time: '10:00', timeZone: 'Europe/London', durationMinutes: 45, staff: { id: tobias.id, name: tobias.name },
  purpose: 'Spot check and weight', status: 'booked', cancelReason: null, rowVersion: 4, ...overrides,
});

type Handler = (request: FakeRequest) => Response;
function stubRecord(role: Role, visits: Visit[], extra: Record<string, Handler> = {}) {
  let visitCalls = 0;
  stubApi({
    'GET /api/session': sessionHandler(role),
    [`GET /api/infants/${ID}`]: () => json(200, infant),
    [`GET /api/infants/${ID}/prescriptions`]: () => json(200, { items: [] }),
    [`GET /api/infants/${ID}/visits`]: () => { visitCalls += 1; return json(200, { items: visits }); },
    'GET /api/users': ({ url }) => {
      const items = url.searchParams.get('role') === 'nurse' ? [tobias] : [];
      return json(200, { items, total: items.length, page: 1, pageSize: 100 });
    },
    ...extra,
  });
  return { visitCalls: () => visitCalls };
}

const visitsCard = async () => (await screen.findByRole('heading', { name: 'Visits' }, { timeout: 5000 })).closest('section') as HTMLElement;

describe('Infant record: visits', () => {
  it('when visits exist, then booked ones are listed in words and cancelled ones are folded away', async () => {
    stubRecord('consultant', [visit(), visit({ id: 'f1f1f1f1-0000-4000-8000-000000000042', status: 'cancelled', cancelReason: 'Family away' })]);
    renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    const booked = await within(card).findByRole('list', { name: 'Booked visits' });
    expect(booked).toHaveTextContent(/Thu 3 Dec, 10:00/);
    expect(booked).toHaveTextContent('Home visit · Tobias Fenwright · 45 min');
    expect(booked).toHaveTextContent('Spot check and weight');
    expect(within(card).getByText('Cancelled and done visits (1)')).toBeInTheDocument();
    expect(within(card).queryByRole('button', { name: 'Book a visit' })).not.toBeInTheDocument();
    expect(within(card).queryByRole('button', { name: 'Move' })).not.toBeInTheDocument();
  });

  it('when the nurse books a visit, then the body is sent and a 400 on the time is shown beside the time field', async () => {
    const posts: FakeRequest[] = [];
    const skipped = 'This time does not exist on that day: the clocks go forward. Choose another time.';
    stubRecord('nurse', [], {
      [`POST /api/infants/${ID}/visits`]: (request) => {
        posts.push(request);
        return apiError(400, 'validation_failed', 'Check the highlighted fields.', { time: [skipped] });
      },
    });
    const { user } = renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    await user.click(within(card).getByRole('button', { name: 'Book a visit' }));
    const form = within(card).getByRole('form', { name: 'Book a visit' });
    await user.type(within(form).getByLabelText('Date'), '2037-03-29');
    // Typed on the 24-hour clock in a plain box: the browser's time box may show am/pm.
    expect(within(form).getByLabelText(/^Time/)).toHaveAttribute('type', 'text');
    expect(within(form).getByLabelText(/^Time/)).toHaveAccessibleDescription(/24-hour clock/);
    await user.type(within(form).getByLabelText(/^Time/), '01:30');
    await user.selectOptions(await within(form).findByLabelText('Who will see the family'), await within(form).findByRole('option', { name: 'Tobias Fenwright' }));
    await user.type(within(form).getByLabelText('What it is for'), 'Spot check and weight');
    await user.click(within(form).getByRole('button', { name: 'Book the visit' }));
    expect(await within(form).findByText(skipped)).toBeInTheDocument();
    expect(within(form).getByLabelText(/^Time/)).toHaveAttribute('aria-invalid', 'true');
    expect(posts[0].body).toEqual({
      kind: 'home_visit', date: '2037-03-29', time: '01:30', durationMinutes: 45, staffId: tobias.id, purpose: 'Spot check and weight',
    });
    expect(within(form).getByLabelText('What it is for')).toHaveValue('Spot check and weight');
  });

  it('when a visit is moved, then its rowVersion is sent and the list is read again', async () => {
    const patches: FakeRequest[] = [];
    const { visitCalls } = stubRecord('coordinator', [visit()], {
      [`PATCH /api/visits/${visit().id}`]: (request) => { patches.push(request); return json(200, visit({ time: '14:00', rowVersion: 5 })); },
    });
    const { user } = renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    await user.click(await within(card).findByRole('button', { name: 'Move' }));
    const time = within(card).getByLabelText(/^New time/);
    await user.clear(time);
    await user.type(time, '14:00');
    const before = visitCalls();
    await user.click(within(card).getByRole('button', { name: 'Move the visit' }));
    expect(await screen.findByText('Visit moved.')).toBeInTheDocument();
    expect(patches[0].body).toEqual({ rowVersion: 4, date: '2037-12-03', time: '14:00' });
    await waitFor(() => expect(visitCalls()).toBeGreaterThan(before));
  });

  it('when someone else changed the visit, then the 409 is explained and the list is reloaded', async () => {
    const { visitCalls } = stubRecord('coordinator', [visit()], {
      [`PATCH /api/visits/${visit().id}`]: () => apiError(409, 'conflict', 'This visit was changed by someone else.'),
    });
    const { user } = renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    await user.click(await within(card).findByRole('button', { name: 'Move' }));
    // The move form's way out is not another "Cancel" beside the visit's own.
    expect(within(card).queryByRole('button', { name: /cancel/i })).not.toBeInTheDocument();
    await user.click(within(card).getByRole('button', { name: 'Keep the visit as it is' }));
    expect(within(card).queryByRole('button', { name: 'Move the visit' })).not.toBeInTheDocument();
    await user.click(await within(card).findByRole('button', { name: 'Move' }));
    const before = visitCalls();
    await user.click(within(card).getByRole('button', { name: 'Move the visit' }));
    expect(await within(card).findByRole('alert')).toHaveTextContent(/changed this visit while you were editing/);
    await waitFor(() => expect(visitCalls()).toBeGreaterThan(before));
  });

  it('when cancelling without a reason, then nothing is sent until one is given', async () => {
    const cancels: FakeRequest[] = [];
    stubRecord('coordinator', [visit()], {
      [`POST /api/visits/${visit().id}/cancel`]: (request) => { cancels.push(request); return json(200, visit({ status: 'cancelled', cancelReason: 'Baby admitted' })); },
    });
    const { user } = renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    await user.click(await within(card).findByRole('button', { name: 'Cancel the visit' }));
    // Inside the form the way out says what it keeps, so it cannot be read as cancelling the visit.
    expect(within(card).getByRole('button', { name: 'Keep the visit as it is' })).toBeInTheDocument();
    expect(within(card).getAllByRole('button', { name: /cancel/i }).map((b) => b.textContent)).toEqual(['Cancel the visit']);
    await user.click(within(card).getByRole('button', { name: 'Cancel the visit' }));
    expect(await within(card).findByText('Say why the visit is cancelled')).toBeInTheDocument();
    expect(cancels).toHaveLength(0);
    await user.type(within(card).getByLabelText('Why it is cancelled'), 'Baby admitted');
    await user.click(within(card).getByRole('button', { name: 'Cancel the visit' }));
    expect(await screen.findByText('Visit cancelled.')).toBeInTheDocument();
    expect(cancels[0].body).toEqual({ reason: 'Baby admitted' });
  });
});

describe('Infant record: marking a visit done', () => {
  // Fixed dates far from any day the tests run on: one long past, one far ahead.
  const past = visit({ id: 'f1f1f1f1-0000-4000-8000-000000000051', startsAt: '2025-11-03T10:00:00.000Z', date: '2025-11-03', time: '10:00' });
  const ahead = visit();

  it('when a booked visit is over, then it is listed apart with "Mark done", which sends its rowVersion; done, it moves to the folded list', async () => {
    const posts: FakeRequest[] = [];
    let done = false;
    stubApi({
      'GET /api/session': sessionHandler('coordinator'),
      [`GET /api/infants/${ID}`]: () => json(200, infant),
      [`GET /api/infants/${ID}/prescriptions`]: () => json(200, { items: [] }),
      [`GET /api/infants/${ID}/visits`]: () => json(200, { items: [done ? { ...past, status: 'done', rowVersion: 5 } : past, ahead] }),
      [`POST /api/visits/${past.id}/done`]: (request) => { posts.push(request); done = true; return json(200, { ...past, status: 'done', rowVersion: 5 }); },
    });
    const { user } = renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    const waiting = await within(card).findByRole('list', { name: 'Past visits not marked done' });
    expect(within(card).getByRole('heading', { name: 'Past visits not marked done (1)' })).toBeInTheDocument();
    expect(waiting).toHaveTextContent(/3 Nov, 10:00/);
    // A visit still days ahead cannot be marked done yet.
    expect(within(within(card).getByRole('list', { name: 'Booked visits' })).queryByRole('button', { name: 'Mark done' })).not.toBeInTheDocument();
    await user.click(within(waiting).getByRole('button', { name: 'Mark done' }));
    expect(await screen.findByText('Visit marked done.')).toBeInTheDocument();
    expect(posts.map((p) => p.body)).toEqual([{ rowVersion: 4 }]);
    expect(await within(card).findByText('Cancelled and done visits (1)')).toBeInTheDocument();
    expect(within(card).queryByRole('list', { name: 'Past visits not marked done' })).not.toBeInTheDocument();
  });

  it('when the API refuses (changed meanwhile), then its words are shown beside the visit', async () => {
    stubRecord('nurse', [past], {
      [`POST /api/visits/${past.id}/done`]: () => apiError(409, 'conflict', 'Someone else changed this visit meanwhile. Reload and try again.'),
    });
    const { user } = renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    await user.click(await within(card).findByRole('button', { name: 'Mark done' }));
    expect(await within(card).findByText('Someone else changed this visit meanwhile. Reload and try again.')).toBeInTheDocument();
  });

  it('when a consultant reads the record, then past visits are listed without "Mark done"', async () => {
    stubRecord('consultant', [past]);
    renderApp(`/infants/${ID}`);
    const card = await visitsCard();
    expect(await within(card).findByRole('list', { name: 'Past visits not marked done' })).toBeInTheDocument();
    expect(within(card).queryByRole('button', { name: 'Mark done' })).not.toBeInTheDocument();
  });
});
