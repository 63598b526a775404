import { configure, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { AdminOverview, ConsultantOverview, CoordinatorOverview, MonthCount } from '@shared/schemas/overview';
import { INFANT_STATUSES } from '@shared/schemas/infants';
import { buildMonthBars, monthTick } from '../../web/features/charts/components/month-bars';
import type { UplotChartProps } from '../../web/features/charts/components/uplot-chart';
import { onOxygenSummary } from '../../web/features/overview/components/on-oxygen-card';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

// jsdom has no canvas: the chart wrapper keeps what it was given instead of drawing.
const drawn: UplotChartProps[] = [];
vi.mock('../../web/features/charts/components/uplot-chart', () => ({
  default: (props: UplotChartProps) => {
    drawn.push(props);
    return <div data-testid="uplot-chart" />;
  },
}));
configure({ asyncUtilTimeout: 5000 });

const ASOF = '2026-12-02T12:00:00.000Z';
const MONTHS: MonthCount[] = ['2026-01', '2026-02', '2026-03', '2026-04', '2026-05', '2026-06', '2026-07', '2026-08', '2026-09', '2026-10', '2026-11', '2026-12']
  .map((month, i) => ({ month, count: [3, 4, 4, 6, 7, 9, 12, 14, 17, 21, 23, 22][i] }));

const coordinator: CoordinatorOverview = {
  role: 'coordinator', asOf: ASOF,
  babiesByStatus: INFANT_STATUSES.map((status, i) => ({ status, count: [2, 8, 1, 18, 4, 3, 0][i] })),
  signOff: { count: 8, oldestSince: '2026-11-28T12:00:00.000Z' },
  overdueChecks: { count: 5, babies: 4 },
  messagesNeedingAction: { failed: 3, unknown: 1 },
  journeysWaiting: {
    count: 2, oldestSince: '2026-11-30T09:00:00.000Z',
    oldest: [
      { id: 'e1e1e1e1-0000-4000-8000-000000000001', infantName: 'Wren Thackeray', destinationName: 'High Saddle', departOn: '2026-12-12', waitingSince: '2026-11-30T09:00:00.000Z' },
      { id: 'e1e1e1e1-0000-4000-8000-000000000002', infantName: 'Ada Brindlewood', destinationName: 'Flight to see family', departOn: '2026-12-20', waitingSince: '2026-12-02T08:30:00.000Z' },
    ],
  },
  discharges: {
    withDate: 1, preparing: 1,
    babies: [
      { infantId: 'd1d1d1d1-0000-4000-8000-000000000001', infantName: 'Ottoline Marsh', dischargedOn: '2026-12-08', missing: [] },
      { infantId: 'd1d1d1d1-0000-4000-8000-000000000002', infantName: 'Bram Pellow', dischargedOn: null,
        missing: [{ key: 'smoke_alarms', label: 'Working smoke alarms in the home' }, { key: 'equipment_installed', label: 'Equipment installed before the discharge date' }] },
    ],
  },
  onOxygenByMonth: MONTHS,
  equipmentOrders: { failed: 1, unconfirmed: 2 },
};

const admin: AdminOverview = {
  role: 'admin', asOf: ASOF,
  people: [
    { role: 'admin', active: 1, disabled: 0 }, { role: 'coordinator', active: 2, disabled: 1 }, { role: 'nurse', active: 5, disabled: 0 },
    { role: 'consultant', active: 2, disabled: 0 }, { role: 'family', active: 31, disabled: 2 },
  ],
  policy: { version: 4, savedAt: '2026-11-12T10:15:00.000Z' },
  messagesThisWeek: { since: '2026-11-30T00:00:00.000Z', sent: 57, failed: 2, unknown: 1 },
  onOxygenByMonth: MONTHS,
};

const consultant: ConsultantOverview = {
  role: 'consultant', asOf: ASOF,
  proposals: { count: 9, oldestSince: '2026-11-29T12:00:00.000Z' },
  journeys: { count: 2, oldestSince: '2026-12-02T07:00:00.000Z' },
  unmetStepDowns: [{ prescriptionId: 'f1f1f1f1-0000-4000-8000-000000000001', infantName: 'Isla Calloway', unmetRules: 2, waitingSince: '2026-12-01T12:00:00.000Z' }],
};

const figure = (name: RegExp) => screen.findByRole('link', { name });

describe('the coordinator overview', () => {
  it('when the programme has work waiting, then each figure is a number with words that opens the list behind it', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator'), 'GET /api/overview': () => json(200, coordinator) });
    renderApp('/coordinator');
    await screen.findByText('Babies by status');
    expect(await figure(/^8 settings waiting for sign-off Oldest has waited 4 days$/)).toHaveAttribute('href', '/caseload?flag=new_setting_waiting');
    expect(screen.getByRole('link', { name: /^5 checks overdue for 4 babies$/ })).toHaveAttribute('href', '/caseload?flag=check_overdue');
    expect(screen.getByRole('link', { name: /^3 messages failed and 1 not known to have arrived$/ })).toHaveAttribute('href', '/messages?status=failed');
    expect(screen.getByRole('link', { name: /^2 journey checks waiting Oldest has waited 2 days$/ })).toHaveAttribute('href', '#journeys-waiting');
    expect(screen.getByRole('link', { name: /^3 equipment orders need a look 2 not confirmed by the date needed, 1 failed to send$/ }))
      .toHaveAttribute('href', '/equipment-orders?status=open');

    expect(screen.getByText('36')).toBeInTheDocument(); // babies in the programme, all statuses
    expect(screen.getByRole('link', { name: 'On home oxygen 18' })).toHaveAttribute('href', '/caseload?status=on_oxygen');
    expect(screen.getByRole('link', { name: 'Left the programme 0' })).toHaveAttribute('href', '/caseload?status=left_programme');

    const journeys = screen.getByRole('region', { name: 'Journey checks waiting for a consultant' });
    expect(within(journeys).getByRole('link', { name: 'Wren Thackeray to High Saddle' })).toHaveAttribute('href', '/journeys/e1e1e1e1-0000-4000-8000-000000000001');
    expect(within(journeys).getByText(/waiting under an hour|waiting 3 hours/)).toBeInTheDocument();
  });

  it('when babies are going home, then the overview counts them and lists each with what is missing, linking to the record', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator'), 'GET /api/overview': () => json(200, coordinator) });
    renderApp('/coordinator');
    expect(await figure(/^1 baby with a discharge date 1 more being prepared$/)).toHaveAttribute('href', '#going-home');
    const list = screen.getByRole('list', { name: 'Babies going home' });
    expect(within(list).getByRole('link', { name: 'Ottoline Marsh' })).toHaveAttribute('href', '/infants/d1d1d1d1-0000-4000-8000-000000000001');
    expect(within(list).getByText(/goes home .*8 December 2026|goes home .*8 Dec 2026/)).toBeInTheDocument();
    expect(within(list).getByText('Every step done')).toBeInTheDocument();
    expect(within(list).getByRole('link', { name: 'Bram Pellow' })).toHaveAttribute('href', '/infants/d1d1d1d1-0000-4000-8000-000000000002');
    expect(within(list).getByText('2 steps missing: Working smoke alarms in the home; Equipment installed before the discharge date')).toBeInTheDocument();
    expect(within(list).getByText('no date yet')).toBeInTheDocument();
  });

  it('when the chart is shown, then its figures are also in words and in a table for screen readers', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator'), 'GET /api/overview': () => json(200, coordinator) });
    renderApp('/coordinator');
    const summary = 'Babies on home oxygen at any time in each month, January 2026 to December 2026. Most: 23 in November 2026. This month so far: 22.';
    // Under the bars for everyone, and as the table's caption.
    expect(await screen.findAllByText(summary)).toHaveLength(2);
    const table = screen.getByRole('table', { name: summary });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(13);
    expect(within(rows[11]).getByRole('rowheader')).toHaveTextContent('November 2026');
    expect(within(rows[11]).getByRole('cell')).toHaveTextContent('23');
    await screen.findByTestId('uplot-chart');
    expect(drawn.at(-1)?.data[1]).toEqual(MONTHS.map((m) => m.count));
  });

  it('when the figures are refused, then the page says so in words', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator'), 'GET /api/overview': () => json(403, { error: { code: 'forbidden', message: 'There is no overview page for your role.' } }) });
    renderApp('/coordinator');
    expect(await screen.findByText('There is no overview page for your role.')).toBeInTheDocument();
  });
});

describe('the admin overview', () => {
  it('when the programme runs, then people, the settings version and this week’s messages are figures that open their pages', async () => {
    stubApi({
      'GET /api/session': sessionHandler('admin'), 'GET /api/overview': () => json(200, admin),
      'GET /api/health/ready': () => json(200, { status: 'ok', db: 'ok', redis: 'ok', migrations: 'current', workers: { status: 'ok', running: 1, seen: [] } }),
    });
    renderApp('/admin');
    expect(await figure(/^41 people can sign in/)).toHaveAttribute('href', '/admin/people');
    expect(screen.getByRole('link', { name: /^57 messages sent since Monday 30 November$/ })).toHaveAttribute('href', '/messages?status=sent');
    expect(screen.getByRole('link', { name: /^2 messages failed since Monday 30 November; 1 more not known to have arrived$/ })).toHaveAttribute('href', '/messages?status=failed');
    expect(screen.getByRole('link', { name: /^Programme settings Version 4 saved 12 November 2026$/ })).toHaveAttribute('href', '/admin/settings');
    expect(screen.getByRole('link', { name: 'Discharge coordinator 2 and 1 disabled' })).toHaveAttribute('href', '/admin/people?role=coordinator');
    expect(screen.getByRole('heading', { level: 2, name: 'Babies on home oxygen by month' })).toBeInTheDocument();
  });
});

describe('the consultant overview', () => {
  it('when decisions wait, then settings and journey checks are counted and step downs with rules not met are named', async () => {
    stubApi({ 'GET /api/session': sessionHandler('consultant'), 'GET /api/overview': () => json(200, consultant) });
    renderApp('/consultant');
    expect(await figure(/^9 settings to sign off Oldest has waited 3 days$/)).toHaveAttribute('href', '/sign-off');
    expect(screen.getByRole('link', { name: /^2 journey checks Oldest has waited 5 hours$/ })).toHaveAttribute('href', '/sign-off');
    expect(screen.getByRole('link', { name: /^1 step down with rules not met/ })).toHaveAttribute('href', '#rules-not-met');
    expect(screen.getByRole('link', { name: 'Review Isla Calloway' })).toHaveAttribute('href', '/sign-off/f1f1f1f1-0000-4000-8000-000000000001');
    expect(screen.getByText(/2 rules not met · waiting 1 day/)).toBeInTheDocument();
  });
});

describe('month bars', () => {
  it('when months cross a new year, then the first month and January carry the year', () => {
    expect(monthTick('2026-03', true)).toBe('Mar 26');
    expect(monthTick('2026-04', false)).toBe('Apr');
    expect(monthTick('2027-01', false)).toBe('Jan 27');
  });

  it('when every month is zero, then the words say no baby was on oxygen and the scale still has room', () => {
    const zero = MONTHS.map((m) => ({ ...m, count: 0 }));
    expect(onOxygenSummary(zero)).toBe('No baby was on home oxygen from January 2026 to December 2026.');
    expect(buildMonthBars(zero, 'Babies').options.scales?.y?.range).toEqual([0, 5]);
  });
});
