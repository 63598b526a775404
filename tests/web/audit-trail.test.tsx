import { configure, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import type { ChainCheck, ReadLogEntry } from '@shared/schemas/audit';
import { AppProviders, createAppQueryClient } from '../../web/app/providers';
import { ReadsSection } from '../../web/features/audit/components/reads-section';
import { json, makeUser, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

configure({ asyncUtilTimeout: 5000 });

const BABY = 'a1a1a1a1-0000-4000-8000-000000000081';
const nurse = makeUser({ name: 'Ada Pennick', role: 'nurse' });
const consultant = makeUser({ name: 'Dr Ilse Varga', role: 'consultant' });

const intact: ChainCheck = { id: '7', checkedAt: '2026-12-02T02:40:00.000Z', checkedBy: null, ok: true, rowsChecked: 1520, broken: null };
const broken: ChainCheck = {
  id: '8', checkedAt: '2026-12-03T09:15:00.000Z', checkedBy: 'Maren Holloway', ok: false, rowsChecked: 41,
  broken: { rowId: '1042', rowAt: '2026-11-30T10:05:00.000Z', seq: 42, problem: 'This row was changed after it was written: its content no longer matches its stored hash.' },
};

describe('checking the audit trail (admin overview)', () => {
  it('when the admin runs the check and the chain is broken, then the first broken row and what mismatched are shown as an alert, and the list is read again', async () => {
    let checksCalls = 0;
    const posts: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler('admin'),
      'GET /api/audit/chain/checks': () => json(200, { items: (checksCalls += 1) === 1 ? [intact] : [broken, intact] }),
      'POST /api/audit/chain/verify': (request) => {
        posts.push(request);
        return json(200, broken);
      },
    });
    const { user } = renderApp('/admin');
    const card = (await screen.findByRole('heading', { name: 'Audit trail' })).closest('section')!;
    expect(await within(card).findByText(/Intact: 1,520 rows checked/)).toBeInTheDocument();
    expect(within(card).getByText(/nightly check/)).toBeInTheDocument();

    await user.click(within(card).getByRole('button', { name: 'Check the audit trail now' }));
    const alert = await within(card).findByRole('alert');
    expect(alert).toHaveTextContent('The audit trail has been altered. Broken at row 1042, position 42 in the chain, written 30 Nov 2026, 10:05: This row was changed after it was written');
    expect(posts).toHaveLength(1);
    expect(posts[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    // The result takes focus, so a screen reader hears it at once.
    expect(alert.parentElement).toHaveFocus();
    await waitFor(() => expect(checksCalls).toBe(2));
    expect(await within(card).findByText(/Maren Holloway/)).toBeInTheDocument();
  });

  it('when the last check found a break, then the card says so before anyone clicks', async () => {
    stubApi({ 'GET /api/session': sessionHandler('admin'), 'GET /api/audit/chain/checks': () => json(200, { items: [broken] }) });
    renderApp('/admin');
    expect(await screen.findByText(/The last check found the audit trail altered/)).toBeInTheDocument();
  });
});

describe('who looked at this record', () => {
  const entry = (n: number, over: Partial<ReadLogEntry> = {}): ReadLogEntry => ({
    id: String(n), at: `2026-11-${String(30 - n).padStart(2, '0')}T09:00:00.000Z`, action: 'infant.viewed', words: 'Opened the baby\'s record',
    person: { id: nurse.id, name: nurse.name, role: 'nurse' }, ip: '198.51.100.4', ...over,
  });

  function renderSection() {
    const calls: URLSearchParams[] = [];
    stubApi({
      'GET /api/session': sessionHandler('admin'),
      'GET /api/users': () => json(200, { items: [nurse, consultant], total: 2 }),
      [`GET /api/infants/${BABY}/reads`]: ({ url }) => {
        calls.push(url.searchParams);
        if (url.searchParams.get('cursor') === 'page-2') return json(200, { items: [entry(3, { words: 'Downloaded the printable care plan' })], nextCursor: null });
        return json(200, { items: [entry(1), entry(2, { person: { id: consultant.id, name: consultant.name, role: 'consultant' }, action: 'infant.plans_viewed', words: 'Looked at the home setting versions' })], nextCursor: 'page-2' });
      },
    });
    const router = createMemoryRouter([{ path: '/infants/:id', element: <ReadsSection infantId={BABY} /> }], { initialEntries: [`/infants/${BABY}`] });
    render(<AppProviders queryClient={createAppQueryClient({ retry: false })}><RouterProvider router={router} /></AppProviders>);
    return { calls, router, user: userEvent.setup() };
  }

  it('when the admin opens it, then each read shows when, who, what and the address; older reads load below', async () => {
    const { user, calls } = renderSection();
    await user.click(screen.getByRole('button', { name: /Who looked at this record/ }));
    const table = await screen.findByRole('table', { name: 'Who looked at this record, newest first' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => r.textContent)).toEqual([
      '29 Nov 2026, 09:00Ada Pennick (nurse)Opened the baby\'s record198.51.100.4',
      '28 Nov 2026, 09:00Dr Ilse Varga (consultant)Looked at the home setting versions198.51.100.4',
    ]);
    await user.click(screen.getByRole('button', { name: 'Show older reads' }));
    expect(await within(table).findByText('Downloaded the printable care plan')).toBeInTheDocument();
    expect(calls.at(-1)?.get('cursor')).toBe('page-2');
    expect(screen.queryByRole('button', { name: 'Show older reads' })).not.toBeInTheDocument();
  });

  it('when a person and days are chosen, then they go in the address and the list is asked again with them', async () => {
    const { user, calls, router } = renderSection();
    await user.click(screen.getByRole('button', { name: /Who looked at this record/ }));
    await screen.findByRole('table');
    await user.selectOptions(await screen.findByLabelText('Person'), await screen.findByRole('option', { name: 'Dr Ilse Varga (consultant)' }));
    await waitFor(() => expect(calls.at(-1)?.get('actorId')).toBe(consultant.id));
    await user.type(screen.getByLabelText('From'), '2026-11-01');
    await waitFor(() => expect(calls.at(-1)?.get('from')).toBe('2026-11-01'));
    expect(currentUrl(router)).toBe(`/infants/${BABY}?reads-by=${consultant.id}&reads-from=2026-11-01`);
  });
});
