import { configure, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { DayItem, DayVisit } from '@shared/schemas/schedule';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const TODAY = '2026-12-01';

function dayItem(overrides: Partial<DayItem> = {}): DayItem {
  return {
    id: 'c1c1c1c1-0000-4000-8000-000000000001',
    infantId: 'a1a1a1a1-0000-4000-8000-000000000001',
    kind: 'spot_check',
    planKey: 'week-1',
    dueAt: `${TODAY}T23:59:00.000Z`,
    dueDate: TODAY,
    status: 'planned',
    doneAt: null,
    infantName: 'Juniper Ashcombe',
    homeAddress: '4 Quarry Lane, Tallow Ridge',
    activeFlowLpm: 0.25,
    correctedAge: '6 weeks 2 days',
    ...overrides,
  };
}

const DAY_ITEMS: DayItem[] = [
  dayItem({
    id: 'c1c1c1c1-0000-4000-8000-000000000002', infantId: 'a1a1a1a1-0000-4000-8000-000000000002', infantName: 'Wren Thackeray',
    homeAddress: '2 Mill Row, Emberly', status: 'overdue', dueDate: '2026-11-28', dueAt: '2026-11-28T23:59:00.000Z', activeFlowLpm: 0.125,
  }),
  dayItem(),
  dayItem({
    id: 'c1c1c1c1-0000-4000-8000-000000000003', infantId: 'a1a1a1a1-0000-4000-8000-000000000003', infantName: 'Ada Brindlewood',
    kind: 'room_air_challenge', homeAddress: '9 Saddle Way, High Saddle', activeFlowLpm: null,
  }),
];

function dayVisit(overrides: Partial<DayVisit> = {}): DayVisit {
  return {
    id: 'd4d4d4d4-0000-4000-8000-000000000001',
    infantId: 'a1a1a1a1-0000-4000-8000-000000000001',
    infantName: 'Juniper Ashcombe',
    homeAddress: '4 Quarry Lane, Tallow Ridge',
    kind: 'home_visit',
    date: TODAY,
    time: '09:30',
    startsAt: `${TODAY}T09:30:00.000Z`,
    durationMinutes: 45,
    purpose: 'Spot check and weight',
    ...overrides,
  };
}

// The first visit loads the lazy page module; with every web test file running at once that can take a few seconds.
configure({ asyncUtilTimeout: 5000 });

describe('My day', () => {
  it('when the day has checks, then they are listed in the order the server planned the round, with overdue said in words', async () => {
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: TODAY, items: DAY_ITEMS }),
    });
    renderApp('/nurse');

    const list = await screen.findByRole('list', { name: 'Checks in route order' });
    const cards = within(list).getAllByRole('listitem');
    expect(cards.map((card) => within(card).getByRole('button').textContent)).toEqual([
      expect.stringContaining('Wren Thackeray'),
      expect.stringContaining('Juniper Ashcombe'),
      expect.stringContaining('Ada Brindlewood'),
    ]);

    const first = within(cards[0]);
    expect(first.getByText('Overdue since Sat 28 Nov')).toBeInTheDocument();
    expect(first.getByText('Spot check')).toBeInTheDocument();
    expect(first.getByText('Corrected age 6 weeks 2 days')).toBeInTheDocument();
    expect(first.getByText('2 Mill Row, Emberly')).toBeInTheDocument();
    expect(first.getByText('0.125 L/min')).toBeInTheDocument();

    expect(within(cards[1]).getByText('Due today')).toBeInTheDocument();
    expect(within(cards[1]).queryByText(/Overdue/)).not.toBeInTheDocument();
    expect(within(cards[2]).getByText('Room-air challenge')).toBeInTheDocument();
    expect(within(cards[2]).getByText('No approved setting')).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: /Tuesday 1 December · 3 checks, in route order/ })).toBeInTheDocument();
  });

  it('when a card is tapped, then its reading form opens with the current flow filled in', async () => {
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: TODAY, items: DAY_ITEMS }),
    });
    const { user } = renderApp('/nurse');
    const card = await screen.findByRole('button', { name: /Wren Thackeray/ });
    expect(card).toHaveAttribute('aria-expanded', 'false');
    await user.click(card);
    expect(card).toHaveAttribute('aria-expanded', 'true');
    const form = screen.getByRole('form', { name: 'Spot reading' });
    expect(within(form).getByLabelText('SpO2 (%)')).toHaveAttribute('inputmode', 'numeric');
    expect(within(form).getByLabelText('Flow at the time (L/min)')).toHaveValue(0.125);
    expect(within(form).getByLabelText('Weight (kg, optional)')).toHaveAttribute('inputmode', 'decimal');
    expect(within(form).getAllByRole('radio').map((radio) => radio.closest('label')?.textContent)).toEqual(['Awake', 'Asleep', 'Feeding', 'Crying']);
  });

  it('when visits are booked with the nurse today, then they come first, by start time, with baby, address, kind, purpose and length', async () => {
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, {
        date: TODAY,
        items: DAY_ITEMS,
        visits: [
          dayVisit(),
          dayVisit({
            id: 'd4d4d4d4-0000-4000-8000-000000000002', infantId: 'a1a1a1a1-0000-4000-8000-000000000003', infantName: 'Ada Brindlewood',
            homeAddress: '9 Saddle Way, High Saddle', kind: 'clinic_review', time: '14:00', startsAt: `${TODAY}T14:00:00.000Z`,
            durationMinutes: 90, purpose: 'Review before the room-air challenge',
          }),
        ],
      }),
    });
    renderApp('/nurse');

    const list = await screen.findByRole('list', { name: 'Visits by start time' });
    expect(screen.getByRole('heading', { name: 'Visits today · 2 visits, by start time' })).toBeInTheDocument();
    const visits = within(list).getAllByRole('listitem');
    expect(visits).toHaveLength(2);

    const first = within(visits[0]);
    expect(first.getByText('09:30')).toBeInTheDocument();
    expect(first.getByRole('link', { name: 'Juniper Ashcombe' })).toHaveAttribute('href', '/infants/a1a1a1a1-0000-4000-8000-000000000001');
    expect(first.getByText('4 Quarry Lane, Tallow Ridge')).toBeInTheDocument();
    expect(first.getByText('Home visit')).toBeInTheDocument();
    expect(first.getByText('Spot check and weight')).toBeInTheDocument();
    expect(first.getByText('45 minutes')).toBeInTheDocument();

    const second = within(visits[1]);
    expect(second.getByText('14:00')).toBeInTheDocument();
    expect(second.getByRole('link', { name: 'Ada Brindlewood' })).toBeInTheDocument();
    expect(second.getByText('Clinic review')).toBeInTheDocument();
    expect(second.getByText('1 hour 30 minutes')).toBeInTheDocument();

    // The visits sit above the round, whose checks are still all there.
    const checks = screen.getByRole('list', { name: 'Checks in route order' });
    expect(list.compareDocumentPosition(checks) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(within(checks).getAllByRole('listitem')).toHaveLength(3);
  });

  it('when no visit is booked today, then the visits section says so in words', async () => {
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: TODAY, items: DAY_ITEMS, visits: [] }),
    });
    renderApp('/nurse');
    expect(await screen.findByText('No visits are booked with you today.')).toBeInTheDocument();
    expect(screen.queryByRole('list', { name: 'Visits by start time' })).not.toBeInTheDocument();
    expect(screen.getByRole('list', { name: 'Checks in route order' })).toBeInTheDocument();
  });

  it('when nothing is due, then the page says so', async () => {
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: TODAY, items: [] }),
    });
    renderApp('/nurse');
    expect(await screen.findByText('Nothing due today.')).toBeInTheDocument();
  });

  it('when a check was done earlier today, then it keeps its place and number, ticked and closed, and the rest keep theirs', async () => {
    const done = dayItem({ status: 'done', doneAt: `${TODAY}T10:40:00.000Z` });
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: TODAY, items: [DAY_ITEMS[0], done, DAY_ITEMS[2]], upcoming: [], visits: [] }),
    });
    renderApp('/nurse');
    const list = await screen.findByRole('list', { name: 'Checks in route order' });
    const stops = within(list).getAllByRole('listitem');
    expect(stops.map((li) => li.textContent?.slice(0, 1))).toEqual(['1', '2', '3']);
    expect(within(stops[1]).getByText('Done')).toBeInTheDocument();
    expect(within(stops[1]).getByRole('link', { name: 'Juniper Ashcombe' })).toHaveAttribute('href', `/infants/${done.infantId}`);
    expect(within(stops[1]).queryByRole('button')).not.toBeInTheDocument();
    expect(within(stops[2]).getByRole('button', { name: /^Ada Brindlewood/ })).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: /3 checks, in route order, 1 done/ })).toBeInTheDocument();
  });

  it('when checks are coming up this week, then each baby\'s name links to the record', async () => {
    const later = dayItem({ id: 'c1c1c1c1-0000-4000-8000-000000000009', dueDate: '2026-12-04', kind: 'overnight_study' });
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: TODAY, items: [], upcoming: [later], visits: [] }),
    });
    renderApp('/nurse');
    const section = (await screen.findByRole('heading', { name: 'Coming up this week' })).closest('section') as HTMLElement;
    expect(within(section).getByRole('link', { name: 'Juniper Ashcombe' })).toHaveAttribute('href', `/infants/${later.infantId}`);
  });
});
