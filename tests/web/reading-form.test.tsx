import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Reading } from '@shared/schemas/readings';
import type { DayItem } from '@shared/schemas/schedule';
import { apiError, json, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

const TODAY = '2026-12-01';
const CHECK_ID = 'c1c1c1c1-0000-4000-8000-000000000002';
const INFANT_ID = 'a1a1a1a1-0000-4000-8000-000000000002';
const READING_ID = 'e1e1e1e1-0000-4000-8000-000000000001';

const item: DayItem = {
  id: CHECK_ID, infantId: INFANT_ID, kind: 'spot_check', planKey: 'week-2', dueAt: '2026-11-28T23:59:00.000Z', dueDate: '2026-11-28',
  status: 'overdue', doneAt: null, infantName: 'Wren Thackeray', homeAddress: '2 Mill Row, Emberly', activeFlowLpm: 0.125,
  correctedAge: '8 weeks',
};
const other: DayItem = { ...item, id: 'c1c1c1c1-0000-4000-8000-000000000009', infantId: 'a1a1a1a1-0000-4000-8000-000000000009', infantName: 'Juniper Ashcombe', status: 'planned', dueDate: TODAY };

function savedReading(body: Record<string, unknown>, overrides: Partial<Reading> = {}): Reading {
  const nurse = sessionUser('nurse');
  return {
    id: READING_ID, infantId: INFANT_ID, checkId: (body.checkId as string) ?? null, takenAt: body.takenAt as string, spo2: body.spo2 as number,
    pulse: (body.pulse as number) ?? null, flowLpm: (body.flowLpm as number) ?? null, state: body.state as Reading['state'],
    weightKg: (body.weightKg as number) ?? null, notes: (body.notes as string) ?? null, familyReported: false,
    createdBy: { id: nurse.id, name: nurse.name }, createdAt: new Date().toISOString(),
    editableUntil: new Date(Date.now() + 30 * 60_000).toISOString(),
    rowVersion: 1,
    ...overrides,
  };
}

function stubDay(save: (request: FakeRequest) => Response | Promise<Response>, patch?: (request: FakeRequest) => Response) {
  let items = [item, other];
  const posts: FakeRequest[] = [];
  const patches: FakeRequest[] = [];
  const routes: Record<string, (request: FakeRequest) => Response | Promise<Response>> = {
    'GET /api/session': sessionHandler('nurse'),
    'GET /api/my-day': () => json(200, { date: TODAY, items }),
    [`POST /api/infants/${INFANT_ID}/readings`]: async (request) => {
      posts.push(request);
      const response = await save(request);
      if (response.status === 201) items = items.filter((entry) => entry.id !== CHECK_ID);
      return response;
    },
    [`PATCH /api/readings/${READING_ID}`]: (request) => {
      patches.push(request);
      return patch ? patch(request) : apiError(500, 'internal', 'not stubbed');
    },
  };
  const fetchMock = stubApi(routes);
  return { posts, patches, fetchMock, routes };
}

async function openAndFill(user: ReturnType<typeof renderApp>['user']) {
  await user.click(await screen.findByRole('button', { name: /^Wren Thackeray/ }));
  const form = screen.getByRole('form', { name: 'Spot reading' });
  await user.type(within(form).getByLabelText('SpO2 (%)'), '94');
  await user.type(within(form).getByLabelText('Pulse (/min)'), '152');
  await user.click(within(form).getByRole('radio', { name: 'Asleep' }));
  await user.type(within(form).getByLabelText('Notes (optional)'), 'Settled after a feed');
  return form;
}

const created = (overrides: Partial<Reading> = {}) => (request: FakeRequest) =>
  json(201, savedReading(request.body as Record<string, unknown>, overrides));

// The first visit loads the lazy page module; with every web test file running at once that can take a few seconds.
configure({ asyncUtilTimeout: 5000 });

describe('Quick reading form', () => {
  it('when saved, then the check, the figures as numbers and the time go to the server, and the card leaves the day', async () => {
    const { posts } = stubDay(created());
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    const before = Date.now();
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));

    await waitFor(() => expect(posts).toHaveLength(1));
    const body = posts[0].body as Record<string, unknown>;
    expect(body).toEqual({ checkId: CHECK_ID, spo2: 94, pulse: 152, flowLpm: 0.125, state: 'asleep', notes: 'Settled after a feed', takenAt: expect.any(String) });
    expect(Math.abs(Date.parse(body.takenAt as string) - before)).toBeLessThan(60_000);

    expect(await screen.findByText('Reading saved.')).toBeInTheDocument();
    await waitFor(() => expect(screen.queryByRole('button', { name: /^Wren Thackeray/ })).not.toBeInTheDocument());
    expect(screen.getByRole('button', { name: /^Juniper Ashcombe/ })).toBeInTheDocument();
    const saved = screen.getByRole('article', { name: 'Saved for Wren Thackeray' });
    expect(within(saved).getByText(/SpO2 94 % · pulse 152 \/min · 0.125 L\/min · Asleep/)).toBeInTheDocument();
  });

  it('when the server finds a problem with SpO2, then it is shown beside SpO2 and everything typed is kept', async () => {
    stubDay(() => apiError(400, 'validation_failed', 'Check the highlighted fields.', { spo2: ['SpO2 does not fit the probe trace'] }));
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));

    const message = await within(form).findByText('SpO2 does not fit the probe trace');
    const spo2 = within(form).getByLabelText('SpO2 (%)');
    expect(spo2).toHaveAttribute('aria-invalid', 'true');
    expect(spo2.getAttribute('aria-describedby')).toContain(message.id);
    expect(spo2).toHaveValue(94);
    expect(within(form).getByLabelText('Pulse (/min)')).toHaveValue(152);
    expect(within(form).getByRole('radio', { name: 'Asleep' })).toBeChecked();
    expect(within(form).getByLabelText('Notes (optional)')).toHaveValue('Settled after a feed');
    expect(within(form).getByRole('button', { name: 'Save reading' })).toBeEnabled();
    // The field message is the only one: no toast repeats it.
    expect(screen.queryByText('Check the highlighted fields.')).not.toBeInTheDocument();
  });

  it('when a save is on its way, then the button is disabled and a second tap sends nothing more', async () => {
    const { posts } = stubDay(() => new Promise<Response>(() => {}));
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    const save = within(form).getByRole('button', { name: 'Save reading' });
    await user.dblClick(save);
    await user.click(save);
    expect(await within(form).findByRole('button', { name: 'Saving…' })).toBeDisabled();
    expect(posts).toHaveLength(1);
  });

  it('when SpO2 or the state is missing, then the shared schema says so and nothing is sent', async () => {
    const { posts } = stubDay(created());
    const { user } = renderApp('/nurse');
    await user.click(await screen.findByRole('button', { name: /^Wren Thackeray/ }));
    const form = screen.getByRole('form', { name: 'Spot reading' });
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    expect(await within(form).findByText('Enter the SpO2 %')).toBeInTheDocument();
    expect(within(form).getByText('Choose awake, asleep, feeding or crying')).toBeInTheDocument();
    expect(posts).toHaveLength(0);
  });

  it('when a weight is given, then it is sent in kg and the nurse is told a new setting is being worked out', async () => {
    const { posts } = stubDay(created());
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.type(within(form).getByLabelText('Weight (kg, optional)'), '4.35');
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    expect(await screen.findByText(/New weight saved: a new setting is being worked out for the consultant/)).toBeInTheDocument();
    expect((posts[0].body as Record<string, unknown>).weightKg).toBe(4.35);
  });
});

describe('Correcting a saved reading', () => {
  it('while the window is open, then "Correct" sends only what changed and shows the corrected figures', async () => {
    const { patches } = stubDay(created(), (request) =>
      json(200, { ...savedReading({ checkId: CHECK_ID, takenAt: new Date().toISOString(), spo2: 94, pulse: 152, flowLpm: 0.125, state: 'asleep' }), ...(request.body as object) }),
    );
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    const saved = await screen.findByRole('article', { name: 'Saved for Wren Thackeray' });
    expect(within(saved).getByText(/You can correct it until/)).toBeInTheDocument();

    await user.click(within(saved).getByRole('button', { name: 'Correct' }));
    const correction = within(saved).getByRole('form', { name: 'Correct the reading' });
    expect(within(correction).getByLabelText('SpO2 (%)')).toHaveValue(94);
    await user.clear(within(correction).getByLabelText('SpO2 (%)'));
    await user.type(within(correction).getByLabelText('SpO2 (%)'), '96');
    await user.click(within(correction).getByRole('button', { name: 'Save correction' }));

    await waitFor(() => expect(patches).toHaveLength(1));
    expect(patches[0].body).toEqual({ spo2: 96, rowVersion: 1 });
    expect(await within(saved).findByText(/SpO2 96 %/)).toBeInTheDocument();
    expect(screen.getByText('Reading corrected.')).toBeInTheDocument();
  });

  it('when the reading was corrected elsewhere meanwhile, then the conflict notice offers a reload and the form starts again from the stored reading', async () => {
    const stored = { checkId: CHECK_ID, takenAt: new Date().toISOString(), spo2: 94, pulse: 152, flowLpm: 0.125, state: 'asleep' };
    const { patches, routes } = stubDay(created(), () => apiError(409, 'conflict', 'This reading was corrected elsewhere meanwhile.', { rowVersion: ['Changed elsewhere'] }));
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    const saved = await screen.findByRole('article', { name: 'Saved for Wren Thackeray' });
    await user.click(within(saved).getByRole('button', { name: 'Correct' }));
    const correction = within(saved).getByRole('form', { name: 'Correct the reading' });
    await user.clear(within(correction).getByLabelText('SpO2 (%)'));
    await user.type(within(correction).getByLabelText('SpO2 (%)'), '96');
    await user.click(within(correction).getByRole('button', { name: 'Save correction' }));

    const notice = await within(correction).findByRole('alert');
    expect(notice).toHaveTextContent('corrected elsewhere meanwhile');
    expect(patches[0].body).toEqual({ spo2: 96, rowVersion: 1 });

    // The other correction made it 97 at version 2; reloading shows it and the next save names version 2.
    routes[`GET /api/infants/${INFANT_ID}/readings`] = () => json(200, { items: [savedReading(stored, { spo2: 97, rowVersion: 2 })] });
    await user.click(within(notice).getByRole('button', { name: 'Reload the reading' }));
    await waitFor(() => expect(within(correction).getByLabelText('SpO2 (%)')).toHaveValue(97));
    expect(within(correction).queryByText(/corrected elsewhere meanwhile/)).not.toBeInTheDocument();
  });

  it('when the window has passed, then there is no "Correct"', async () => {
    stubDay(created({ editableUntil: new Date(Date.now() - 1000).toISOString() }));
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    const saved = await screen.findByRole('article', { name: 'Saved for Wren Thackeray' });
    expect(within(saved).queryByRole('button', { name: 'Correct' })).not.toBeInTheDocument();
  });

  it('when the window closes while the reading is on screen, then "Correct" goes away by itself', async () => {
    stubDay(created({ editableUntil: new Date(Date.now() + 4000).toISOString() }));
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    const saved = await screen.findByRole('article', { name: 'Saved for Wren Thackeray' });
    expect(within(saved).getByRole('button', { name: 'Correct' })).toBeInTheDocument();
    await waitFor(() => expect(within(saved).queryByRole('button', { name: 'Correct' })).not.toBeInTheDocument(), { timeout: 6000 });
  }, 15_000);

  it('when someone else logged the reading, then there is no "Correct"', async () => {
    stubDay(created({ createdBy: { id: '9a9a9a9a-0000-4000-8000-000000000077', name: 'Someone Else' } }));
    const { user } = renderApp('/nurse');
    const form = await openAndFill(user);
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    const saved = await screen.findByRole('article', { name: 'Saved for Wren Thackeray' });
    expect(within(saved).queryByRole('button', { name: 'Correct' })).not.toBeInTheDocument();
  });
});
