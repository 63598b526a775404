import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { InfantSummary } from '@shared/schemas/infants';
import type { Visit } from '@shared/schemas/visits';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const juniper: InfantSummary = {
  id: '5c5c5c5c-0000-4000-8000-000000000041', name: 'Juniper Ashcombe', correctedAge: '6 weeks', homeElevationM: 610,
  homePressureMmHg: 706.5, activeFlowLpm: 0.25, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
};

const visit = (n: number, overrides: Partial<Visit>): Visit => ({
  id: `f2f2f2f2-0000-4000-8000-${String(n).padStart(12, '0')}`, infantId: juniper.id, kind: 'home_visit',
  startsAt: '2037-12-03T10:00:00.000Z', date: '2037-12-03', time: '10:00', timeZone: 'Europe/London', durationMinutes: 45,
  staff: { id: '9a9a9a9a-0000-4000-8000-000000000041', name: 'Tobias Fenwright' }, purpose: 'Spot check and weight',
  status: 'booked', cancelReason: null, rowVersion: 1, ...overrides,
});

function stubFamily(visits: Visit[]) {
  const asked = { visits: 0 };
  stubApi({
    'GET /api/session': sessionHandler('family'),
    'GET /api/infants': () => json(200, { items: [juniper], total: 1 }),
    [`GET /api/infants/${juniper.id}/prescriptions`]: () => json(200, { items: [] }),
    [`GET /api/infants/${juniper.id}/visits`]: () => {
      asked.visits++;
      return json(200, { items: visits });
    },
  });
  return asked;
}

describe('Family page: next visits', () => {
  it('when visits are booked, then they are listed in plain words, the next first, without cancelled or past ones', async () => {
    stubFamily([
      visit(1, { startsAt: '2020-01-02T10:00:00.000Z', date: '2020-01-02', purpose: 'Long past' }),
      visit(2, { startsAt: '2037-12-10T14:30:00.000Z', date: '2037-12-10', time: '14:30', kind: 'clinic_review', purpose: 'Review with the consultant' }),
      visit(3, {}),
      visit(4, { startsAt: '2037-12-05T09:00:00.000Z', date: '2037-12-05', time: '09:00', status: 'cancelled', cancelReason: 'Nurse unwell', purpose: 'Called off' }),
    ]);
    renderApp('/family');
    const list = await screen.findByRole('list', { name: 'Your next visits' }, { timeout: 5000 });
    expect(within(list).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'Home visit on Thursday 3 December at 10:00 with Tobias Fenwright — Spot check and weight',
      'Clinic review on Thursday 10 December at 14:30 with Tobias Fenwright — Review with the consultant',
    ]);
    expect(screen.queryByText(/Called off|Long past/)).not.toBeInTheDocument();
  });

  it('when nothing is booked, then the card says visits will show here', async () => {
    const asked = stubFamily([visit(1, { status: 'cancelled', cancelReason: 'Family away' })]);
    renderApp('/family');
    // Only meaningful once the visits have actually been read.
    await waitFor(() => expect(asked.visits).toBeGreaterThan(0));
    await new Promise((r) => setTimeout(r, 50));
    expect(await screen.findByText('Visits booked by your home-care team will show here.', undefined, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.queryByRole('list', { name: 'Your next visits' })).not.toBeInTheDocument();
  });
});
