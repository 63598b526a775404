import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { Role } from '@shared/auth/roles';
import { INFANT_FLAG_LABELS, INFANT_STATUS_LABELS, type InfantSummary } from '@shared/schemas/infants';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const rows: InfantSummary[] = [
  {
    id: '7a7a7a7a-0000-4000-8000-000000000001', name: 'Juniper Ashdown', correctedAge: '6 wk 2 d', homeElevationM: 1780,
    homePressureMmHg: 614.2, activeFlowLpm: 0.125, status: 'on_oxygen', nurse: { id: '9a9a9a9a-0000-4000-8000-000000000001', name: 'Ada Pennick' },
    consultant: { id: '9a9a9a9a-0000-4000-8000-000000000002', name: 'Dr Ilse Varga' }, flags: ['growth_drift', 'new_setting_waiting'],
  },
  {
    id: '7a7a7a7a-0000-4000-8000-000000000002', name: 'Tamsin Reedy', correctedAge: '2 wk', homeElevationM: null,
    homePressureMmHg: 701.46, activeFlowLpm: null, status: 'awaiting_signoff', nurse: null, consultant: null, flags: [],
  },
];

function stubCaseload(role: Role, items = rows, total = 60, extra: { totalIsEstimate?: boolean } = {}) {
  const listCalls: URLSearchParams[] = [];
  stubApi({
    'GET /api/session': sessionHandler(role),
    'GET /api/infants': ({ url }) => {
      listCalls.push(url.searchParams);
      // Cursors name the page they sit beside, so a test can see which one was sent.
      const page = Number(url.searchParams.get('page') ?? 1);
      return json(200, { items, total, ...extra, nextCursor: `after-${page}`, prevCursor: page > 1 ? `before-${page}` : null });
    },
  });
  return listCalls;
}

describe('Caseload', () => {
  it('when the list answers, then each baby is a row with a record link, place, flow, status and flag labels', async () => {
    stubCaseload('coordinator');
    renderApp('/caseload');
    const table = await screen.findByRole('table');
    const body = within(table).getAllByRole('row').slice(1);
    expect(body).toHaveLength(2);
    const first = within(body[0]);
    expect(first.getByRole('link', { name: 'Juniper Ashdown' })).toHaveAttribute('href', `/infants/${rows[0].id}`);
    expect(first.getByText('1,780 m')).toBeInTheDocument();
    expect(first.getByText('0.125 L/min')).toBeInTheDocument();
    expect(first.getByText(INFANT_STATUS_LABELS.on_oxygen)).toBeInTheDocument();
    expect(first.getByText(INFANT_FLAG_LABELS.growth_drift)).toBeInTheDocument();
    expect(first.getByText(INFANT_FLAG_LABELS.new_setting_waiting)).toBeInTheDocument();
    const second = within(body[1]);
    expect(second.getByText('measured 701.5 mmHg')).toBeInTheDocument();
    expect(second.getByText(INFANT_STATUS_LABELS.awaiting_signoff)).toBeInTheDocument();
    expect(second.getAllByText('—').length).toBeGreaterThanOrEqual(3);
    expect(screen.getByText('Page 1 of 3 · 60 babies')).toBeInTheDocument();
  });

  it('when sorting, paging and filtering, then each choice goes into the URL and the request', async () => {
    const listCalls = stubCaseload('coordinator');
    const { user, router } = renderApp('/caseload');
    await screen.findByRole('table');

    await user.click(screen.getByRole('button', { name: /^Home elevation/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?sort=elevation'));
    expect(screen.getByRole('columnheader', { name: /Home elevation/ })).toHaveAttribute('aria-sort', 'ascending');
    await user.click(screen.getByRole('button', { name: /^Home elevation/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?sort=-elevation'));

    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?page=2&sort=-elevation&cursor=after-1'));

    await user.selectOptions(screen.getByLabelText('Status'), INFANT_STATUS_LABELS.awaiting_signoff);
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?sort=-elevation&status=awaiting_signoff'));
    await user.selectOptions(screen.getByLabelText('Flag'), 'Clinical: Outgrowing flow');
    await user.type(screen.getByLabelText('Search by name'), 'ash{Enter}');
    await waitFor(() =>
      expect(currentUrl(router)).toBe('/caseload?sort=-elevation&status=awaiting_signoff&q=ash&flag=growth_drift'),
    );
    await waitFor(() => expect(listCalls.at(-1)?.get('q')).toBe('ash'));
    expect(Object.fromEntries(listCalls.at(-1)!)).toEqual({
      page: '1', pageSize: '25', sort: '-elevation', status: 'awaiting_signoff', flag: 'growth_drift', q: 'ash', direction: 'next',
    });
    expect(screen.queryByLabelText('Only mine')).not.toBeInTheDocument();
  });

  it('when pages are turned, then each asks for the rows beside the last page, and back to page 1 is the plain first page', async () => {
    const listCalls = stubCaseload('coordinator');
    const { user, router } = renderApp('/caseload');
    await screen.findByRole('table');
    expect(screen.getByRole('button', { name: 'Previous page' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?page=2&cursor=after-1'));
    await user.click(await screen.findByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?page=3&cursor=after-2'));
    await waitFor(() => expect(screen.getByText('Page 3 of 3 · 60 babies')).toBeInTheDocument());
    await user.click(screen.getByRole('button', { name: 'Previous page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?page=2&cursor=before-3&direction=prev'));
    await waitFor(() => expect(listCalls.at(-1)?.get('direction')).toBe('prev'));
    await user.click(await screen.findByRole('button', { name: 'Previous page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload'));
    // A new sort starts from the first page: a cursor belongs to the order it was made in.
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?page=2&cursor=after-1'));
    await user.click(screen.getByRole('button', { name: /^Home elevation/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?sort=elevation'));
  });

  it('when the programme is very large, then the total is given as "about"', async () => {
    stubCaseload('coordinator', rows, 203_117, { totalIsEstimate: true });
    renderApp('/caseload');
    expect(await screen.findByText('Page 1 of about 8,125 · about 203,117 babies')).toBeInTheDocument();
  });

  it('when a consultant ticks "Only mine", then scope=mine is in the URL and the request', async () => {
    const listCalls = stubCaseload('consultant');
    const { user, router } = renderApp('/caseload');
    await screen.findByRole('table');
    await user.click(screen.getByLabelText('Only mine'));
    await waitFor(() => expect(currentUrl(router)).toBe('/caseload?scope=mine'));
    await waitFor(() => expect(listCalls.at(-1)?.get('scope')).toBe('mine'));
  });

  it('when a nurse opens a link asking for the whole programme, then no scope is sent', async () => {
    const listCalls = stubCaseload('nurse');
    renderApp('/caseload?scope=programme');
    await screen.findByRole('table');
    expect(listCalls[0].has('scope')).toBe(false);
    expect(screen.getByRole('heading', { name: 'My caseload' })).toBeInTheDocument();
    expect(screen.queryByRole('columnheader', { name: 'Nurse' })).not.toBeInTheDocument();
    expect(screen.getByRole('columnheader', { name: 'Consultant' })).toBeInTheDocument();
    expect(screen.queryByLabelText('Only mine')).not.toBeInTheDocument();
  });

  it('when nothing matches, then an empty state says so', async () => {
    stubCaseload('coordinator', [], 0);
    renderApp('/caseload?status=left_programme');
    expect(await screen.findByText('No baby matches these filters.')).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
  });

  it('when a baby is off oxygen or has left, then no flow is shown as current: the words say why', async () => {
    stubCaseload('coordinator', [
      { ...rows[0], id: '7a7a7a7a-0000-4000-8000-000000000003', name: 'Odile Marsh', status: 'off_oxygen', activeFlowLpm: 0.1, flags: [] },
      { ...rows[0], id: '7a7a7a7a-0000-4000-8000-000000000004', name: 'Lark Penrose', status: 'left_programme', activeFlowLpm: 0.05, flags: [] },
    ], 2);
    renderApp('/caseload');
    const body = within(await screen.findByRole('table')).getAllByRole('row').slice(1);
    expect(within(body[0]).getByText('None, off oxygen')).toBeInTheDocument();
    expect(within(body[1]).getByText('None, left the programme')).toBeInTheDocument();
    expect(screen.queryByText(/0\.1 L\/min|0\.05 L\/min/)).not.toBeInTheDocument();
  });

  it('when a baby has clinical and administrative flags, then each says its kind in words (and icon), clinical first', async () => {
    stubCaseload('coordinator', [{ ...rows[0], flags: ['check_overdue', 'below_target'] }], 1);
    renderApp('/caseload');
    const flags = within(await screen.findByRole('list', { name: 'Flags' })).getAllByRole('listitem');
    expect(flags.map((f) => f.textContent)).toEqual([`Clinical${INFANT_FLAG_LABELS.below_target}`, `To do${INFANT_FLAG_LABELS.check_overdue}`]);
    for (const flag of flags) expect(flag.querySelector('svg[aria-hidden="true"]')).not.toBeNull();
    // Two different icons, so the kinds differ in shape as well as in words.
    expect(flags[0].querySelector('svg')!.innerHTML).not.toBe(flags[1].querySelector('svg')!.innerHTML);
  });

  it('when the screen is narrow, then each baby is a card with every fact and the order is chosen from a menu', async () => {
    const listeners: Array<() => void> = [];
    vi.stubGlobal('matchMedia', (query: string) => ({
      matches: false, media: query, addEventListener: (_: string, l: () => void) => listeners.push(l), removeEventListener: () => undefined,
    }));
    try {
      const listCalls = stubCaseload('coordinator');
      const { user, router } = renderApp('/caseload');
      const cards = within(await screen.findByRole('list', { name: 'Babies in the caseload' })).getAllByRole('listitem').filter((li) => li.querySelector('h2'));
      expect(screen.queryByRole('table')).not.toBeInTheDocument();
      expect(cards).toHaveLength(2);
      const first = within(cards[0]);
      expect(first.getByRole('heading', { level: 2, name: 'Juniper Ashdown' })).toBeInTheDocument();
      expect(first.getByRole('link', { name: 'Juniper Ashdown' })).toHaveAttribute('href', `/infants/${rows[0].id}`);
      for (const text of ['0.125 L/min', '6 wk 2 d', '1,780 m', 'Ada Pennick', 'Dr Ilse Varga', INFANT_STATUS_LABELS.on_oxygen, INFANT_FLAG_LABELS.growth_drift]) {
        expect(first.getByText(text)).toBeInTheDocument();
      }
      await user.selectOptions(screen.getByLabelText('Sort by'), 'Home elevation, highest first');
      await waitFor(() => expect(currentUrl(router)).toBe('/caseload?sort=-elevation'));
      await waitFor(() => expect(listCalls.at(-1)?.get('sort')).toBe('-elevation'));
      expect(screen.getByText('Page 1 of 3 · 60 babies')).toBeInTheDocument();
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it('when filters, search and sort are set, then "Download CSV" asks for the same view without paging, and follows each change', async () => {
    stubCaseload('coordinator');
    const { user } = renderApp('/caseload?sort=-name&status=on_oxygen&page=2&pageSize=50&cursor=after-1');
    await screen.findByRole('table');
    const link = screen.getByRole('link', { name: 'Download CSV' });
    expect(link).toHaveAttribute('href', '/api/infants.csv?sort=-name&status=on_oxygen');
    expect(link).toHaveAttribute('download');
    await user.selectOptions(screen.getByLabelText('Flag'), 'Clinical: Outgrowing flow');
    await user.type(screen.getByLabelText('Search by name'), 'ash{Enter}');
    await waitFor(() => expect(screen.getByRole('link', { name: 'Download CSV' })).toHaveAttribute('href', '/api/infants.csv?sort=-name&status=on_oxygen&q=ash&flag=growth_drift'));
  });
});
