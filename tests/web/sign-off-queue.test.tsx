import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { QueueItem } from '@shared/schemas/prescriptions';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const hoursAgo = (hours: number) => new Date(Date.now() - hours * 3_600_000).toISOString();

function queueItem(n: number, overrides: Partial<QueueItem> = {}): QueueItem {
  return {
    prescriptionId: `7b7b7b7b-0000-4000-8000-${String(n).padStart(12, '0')}`,
    infantId: `5c5c5c5c-0000-4000-8000-${String(n).padStart(12, '0')}`,
    infantName: `Baby ${n}`,
    correctedAge: '6 weeks',
    homeElevationM: 610,
    homePressureMmHg: 706.5,
    siteName: 'Larkmoor Regional Children’s Hospital',
    reason: 'enrolment',
    proposedFlowLpm: 0.25,
    feasible: true,
    warningCount: 0, unmetChecks: 0,
    waitingSince: hoursAgo(1),
    ...overrides,
  };
}

// As the server sends them: oldest first.
const items: QueueItem[] = [
  queueItem(1, { infantName: 'Juniper Ashcombe', correctedAge: '4 weeks 2 days', homeElevationM: 1240, warningCount: 2, waitingSince: hoursAgo(50) }),
  queueItem(2, {
    infantName: 'Otto Brackenridge', reason: 'home_location', homeElevationM: null, homePressureMmHg: 612.4,
    proposedFlowLpm: null, feasible: false, warningCount: 1, waitingSince: hoursAgo(5),
  }),
  queueItem(3, { infantName: 'Wren Tallis', reason: 'weight', proposedFlowLpm: 0.125, waitingSince: hoursAgo(0.5) }),
  queueItem(4, { infantName: 'Ivo Penrose', waitingSince: hoursAgo(0.1) }),
];

describe('Sign-off queue', () => {
  it('when proposals are waiting, then they are listed oldest first with their facts in words', async () => {
    stubApi({ 'GET /api/session': sessionHandler('consultant'), 'GET /api/prescriptions/queue': () => json(200, { items }) });
    renderApp('/sign-off');

    const list = await screen.findByRole('list', { name: 'Waiting for sign-off, oldest first' });
    const cards = within(list).getAllByRole('article');
    expect(cards.map((card) => within(card).getByRole('heading').textContent)).toEqual([
      'Juniper Ashcombe', 'Otto Brackenridge', 'Wren Tallis', 'Ivo Penrose',
    ]);

    const first = within(cards[0]);
    expect(first.getByText('Corrected age 4 weeks 2 days')).toBeInTheDocument();
    expect(first.getByText('1,240 m')).toBeInTheDocument();
    expect(first.getByText('Enrolment')).toBeInTheDocument();
    expect(first.getByText('0.25 L/min')).toBeInTheDocument();
    expect(first.getByText('2 points to check')).toBeInTheDocument();
    expect(first.getByText('2 days ago')).toBeInTheDocument();
    expect(first.getByText('Larkmoor Regional Children’s Hospital')).toBeInTheDocument();

    const second = within(cards[1]);
    expect(second.getByText('Home elevation or pressure changed')).toBeInTheDocument();
    expect(second.getByText('Measured 612.4 mmHg')).toBeInTheDocument();
    expect(second.getByText('No setting reaches the target — decide')).toBeInTheDocument();
    expect(second.getByText('1 point to check')).toBeInTheDocument();
    expect(second.getByText('5 hours ago')).toBeInTheDocument();

    expect(within(cards[2]).getByText('Weight changed')).toBeInTheDocument();
    expect(within(cards[2]).getByText('0.125 L/min')).toBeInTheDocument();
    expect(within(cards[2]).getByText('No points to check')).toBeInTheDocument();
    expect(within(cards[2]).getByRole('link', { name: 'Review proposal for Wren Tallis' })).toHaveAttribute(
      'href', `/sign-off/${items[2].prescriptionId}`,
    );
  });

  it('when nothing is waiting, then it says so', async () => {
    stubApi({ 'GET /api/session': sessionHandler('consultant'), 'GET /api/prescriptions/queue': () => json(200, { items: [] }) });
    renderApp('/sign-off');
    expect(await screen.findByText('Nothing is waiting for your sign-off.')).toBeInTheDocument();
  });

  it.each(['/sign-off', `/sign-off/${items[0].prescriptionId}`])('when a family opens %s, then it is refused and nothing is fetched', async (path) => {
    const fetchMock = stubApi({ 'GET /api/session': sessionHandler('family') });
    renderApp(path);
    expect(await screen.findByRole('heading', { level: 1, name: 'Not part of your work' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to your home page' })).toHaveAttribute('href', '/family');
    const paths = fetchMock.mock.calls.map(([input]) => new URL(String(input), 'http://localhost').pathname);
    expect(paths.filter((p) => p.startsWith('/api/prescriptions'))).toEqual([]);
  });
});
