import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Reading } from '@shared/schemas/readings';
import { json, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

const ID = 'a1a1a1a1-0000-4000-8000-000000000071';
const nurse = sessionUser('nurse');
const infant: InfantDetail = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Wrenbrook', location: { elevationM: 610 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 610, homePressureMmHg: 705.1, activeFlowLpm: 0.25, status: 'on_oxygen', flags: [],
  activeSetting: {
    prescriptionId: 'b1b1b1b1-0000-4000-8000-000000000031', version: 1, flowLpm: 0.25, source: 'concentrator', sourceO2Percent: 95,
    effectiveFio2: 0.27, periods: null, approvedAt: '2025-04-03T10:00:00.000Z',
  },
  nurse: { id: nurse.id, name: nurse.name }, consultant: null, contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
};

let saved = 0;
const reply = (request: FakeRequest): Reading => {
  const body = request.body as Record<string, unknown>;
  saved += 1;
  return {
    id: `e1e1e1e1-0000-4000-8000-00000000007${saved}`, infantId: ID, checkId: null, takenAt: body.takenAt as string, spo2: body.spo2 as number,
    pulse: (body.pulse as number) ?? null, flowLpm: (body.flowLpm as number) ?? null, state: body.state as Reading['state'], weightKg: null,
    notes: (body.notes as string) ?? null, familyReported: false, createdBy: { id: nurse.id, name: nurse.name },
    createdAt: '2025-04-14T09:00:00.000Z', editableUntil: '2025-04-14T09:30:00.000Z', rowVersion: 1,
  };
};

configure({ asyncUtilTimeout: 5000 });

describe('Another reading', () => {
  it('when a reading is saved, then the next form starts empty (SpO2, pulse, state, notes) with the current flow filled in', async () => {
    const posts: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      [`GET /api/infants/${ID}`]: () => json(200, infant),
      [`POST /api/infants/${ID}/readings`]: (request) => (posts.push(request), json(201, reply(request))),
    });
    const { user } = renderApp(`/infants/${ID}/reading`);
    const first = await screen.findByRole('form', { name: 'Spot reading' });
    await user.type(within(first).getByLabelText('SpO2 (%)'), '94');
    await user.type(within(first).getByLabelText('Pulse (/min)'), '152');
    await user.click(within(first).getByRole('radio', { name: 'Asleep' }));
    await user.type(within(first).getByLabelText('Notes (optional)'), 'Settled after a feed');
    await user.click(within(first).getByRole('button', { name: 'Save reading' }));
    await waitFor(() => expect(posts).toHaveLength(1));

    await screen.findByRole('heading', { name: 'Another reading' });
    const next = screen.getByRole('form', { name: 'Spot reading' });
    await waitFor(() => expect(within(next).getByLabelText('SpO2 (%)')).toHaveValue(null));
    expect(within(next).getByLabelText('Pulse (/min)')).toHaveValue(null);
    expect(within(next).getByLabelText('Notes (optional)')).toHaveValue('');
    expect(within(next).getByRole('radio', { name: 'Asleep' })).not.toBeChecked();
    expect(within(next).getByLabelText('Flow at the time (L/min)')).toHaveValue(0.25);

    // The fresh form saves only what is typed into it now.
    await user.type(within(next).getByLabelText('SpO2 (%)'), '97');
    await user.click(within(next).getByRole('radio', { name: 'Awake' }));
    await user.click(within(next).getByRole('button', { name: 'Save reading' }));
    await waitFor(() => expect(posts).toHaveLength(2));
    expect(posts[1].body).toMatchObject({ spo2: 97, state: 'awake', flowLpm: 0.25 });
    expect(posts[1].body).not.toHaveProperty('pulse');
    expect(posts[1].body).not.toHaveProperty('notes');
  });
});
