import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { User } from '@shared/schemas/users';
import { apiError, json, makeUser, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const me = sessionUser('admin');
const rows: User[] = [
  makeUser({ id: me.id, name: me.name, email: me.email, role: 'admin', lastSignInAt: '2025-05-01T08:30:00.000Z' }),
  makeUser({ name: 'Ada Pennick', email: 'ada.pennick@larkmoor.example', role: 'nurse' }),
  makeUser({ name: 'Corin Ashdown', email: 'corin@larkmoor.example', role: 'family', disabled: true }),
  makeUser({ name: 'Fern Oakley', email: 'fern@larkmoor.example', role: 'consultant', passwordSet: false }),
];

function stubPeople(extra: Record<string, (request: FakeRequest) => Response> = {}, list: { total?: number; totalIsEstimate?: boolean } = {}) {
  const listCalls: URLSearchParams[] = [];
  const fetchMock = stubApi({
    'GET /api/session': sessionHandler('admin'),
    'GET /api/users': ({ url }) => {
      listCalls.push(url.searchParams);
      const total = list.total ?? 60;
      // Cursors name the page they sit beside, so a test can see which one was sent.
      const page = Number(url.searchParams.get('page') ?? 1);
      const more = page * Number(url.searchParams.get('pageSize') ?? 25) < total;
      return json(200, { items: rows, total, totalIsEstimate: list.totalIsEstimate ?? false, nextCursor: more ? `after-${page}` : null, prevCursor: page > 1 ? `before-${page}` : null });
    },
    ...extra,
  });
  return { listCalls, fetchMock };
}

describe('People table', () => {
  it('when the list answers, then each person is a row with role label, status in words and last sign-in', async () => {
    stubPeople();
    renderApp('/admin/people');
    const table = await screen.findByRole('table');
    const bodyRows = within(table).getAllByRole('row').slice(1);
    expect(bodyRows).toHaveLength(4);
    expect(within(bodyRows[1]).getByText('Ada Pennick')).toBeInTheDocument();
    expect(within(bodyRows[1]).getByText('Home-care nurse')).toBeInTheDocument();
    expect(within(bodyRows[1]).getByText('Active')).toBeInTheDocument();
    expect(within(bodyRows[1]).getByText('Never')).toBeInTheDocument();
    expect(within(bodyRows[2]).getByText('Disabled')).toBeInTheDocument();
    expect(within(bodyRows[0]).getByText('Your account')).toBeInTheDocument();
    expect(screen.getByText('Page 1 of 3 · 60 people')).toBeInTheDocument();
  });

  it('when an address is long, then it may wrap only before the @ and the dots of the domain, never inside a word', async () => {
    stubPeople();
    renderApp('/admin/people');
    const address = await screen.findByText('ada.pennick@larkmoor.example');
    expect(address.className).not.toMatch(/break-all/);
    // Each <wbr> is a place the line may break; the text between them is kept whole.
    const pieces = address.innerHTML.split('<wbr>');
    expect(pieces).toEqual(['ada.pennick', '@larkmoor', '.example']);
  });

  it('when a header or the next page is clicked, then sort and page go into the URL and the request', async () => {
    const { listCalls } = stubPeople();
    const { user, router } = renderApp('/admin/people');
    await screen.findByRole('table');

    await user.click(screen.getByRole('button', { name: /^Name/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?sort=-name'));
    expect(screen.getByRole('columnheader', { name: /Name/ })).toHaveAttribute('aria-sort', 'descending');

    await user.click(screen.getByRole('button', { name: /^E-mail/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?sort=email'));

    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=2&sort=email&cursor=after-1'));
    await waitFor(() => expect(listCalls.at(-1)?.get('page')).toBe('2'));
    expect(Object.fromEntries(listCalls.at(-1)!)).toEqual({ page: '2', pageSize: '25', sort: 'email', cursor: 'after-1', direction: 'next' });
  });

  it('when pages are turned, then each asks for the rows beside the last page, back to page 1 is the plain first page, and a filter, search or sort starts again', async () => {
    const { listCalls } = stubPeople();
    const { user, router } = renderApp('/admin/people?role=nurse');
    await screen.findByRole('table');
    expect(screen.getByRole('button', { name: 'Previous page' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=2&role=nurse&cursor=after-1'));
    await user.click(await screen.findByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=3&role=nurse&cursor=after-2'));
    await waitFor(() => expect(screen.getByText('Page 3 of 3 · 60 people')).toBeInTheDocument());
    expect(screen.getByRole('button', { name: 'Next page' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Previous page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=2&role=nurse&cursor=before-3&direction=prev'));
    await waitFor(() => expect(Object.fromEntries(listCalls.at(-1)!)).toEqual({ page: '2', pageSize: '25', sort: 'name', role: 'nurse', cursor: 'before-3', direction: 'prev' }));
    await user.click(await screen.findByRole('button', { name: 'Previous page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?role=nurse'));

    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=2&role=nurse&cursor=after-1'));
    await user.type(screen.getByLabelText('Search by name or e-mail'), 'ada{Enter}');
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?role=nurse&q=ada'));
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=2&role=nurse&q=ada&cursor=after-1'));
    await user.click(screen.getByRole('button', { name: /^Role/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?sort=role&role=nurse&q=ada'));
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?page=2&sort=role&role=nurse&q=ada&cursor=after-1'));
    await user.selectOptions(screen.getByLabelText('Filter by role'), 'Consultant');
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?sort=role&role=consultant&q=ada'));
  });

  it('when the programme has very many people, then the total is given as "about"', async () => {
    stubPeople({}, { total: 12_480, totalIsEstimate: true });
    renderApp('/admin/people');
    expect(await screen.findByText('Page 1 of about 500 · about 12,480 people')).toBeInTheDocument();
  });

  it('when the page is opened from a saved link, then the view is restored from the URL', async () => {
    const { listCalls } = stubPeople();
    renderApp('/admin/people?page=2&pageSize=10&sort=-role&role=nurse&q=ada');
    await screen.findByRole('table');
    const params = listCalls[0];
    expect(Object.fromEntries(params)).toEqual({ page: '2', pageSize: '10', sort: '-role', role: 'nurse', q: 'ada', direction: 'next' });
    expect(screen.getByLabelText('Filter by role')).toHaveValue('nurse');
    expect(screen.getByLabelText('Search by name or e-mail')).toHaveValue('ada');
    expect(screen.getByLabelText('Rows per page')).toHaveValue('10');
  });

  it('when filtering by role or searching, then the filter is in the URL and the page starts again at 1', async () => {
    stubPeople();
    const { user, router } = renderApp('/admin/people?page=3');
    await screen.findByRole('table');
    await user.selectOptions(screen.getByLabelText('Filter by role'), 'Consultant');
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?role=consultant'));
    await user.type(screen.getByLabelText('Search by name or e-mail'), 'varga{Enter}');
    await waitFor(() => expect(currentUrl(router)).toBe('/admin/people?role=consultant&q=varga'));
  });

  it('when Disable is confirmed, then the request carries the CSRF token and the result is announced', async () => {
    const disable: FakeRequest[] = [];
    stubPeople({
      [`POST /api/users/${rows[1].id}/disable`]: (request) => {
        disable.push(request);
        return json(200, { user: { ...rows[1], disabled: true } });
      },
    });
    const { user } = renderApp('/admin/people');
    await user.click(await screen.findByRole('button', { name: 'Disable Ada Pennick' }));
    expect(screen.getByText('Disable Ada Pennick? They are signed out everywhere at once.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Yes, disable' }));

    expect(await screen.findByText('Ada Pennick can no longer sign in.')).toBeInTheDocument();
    expect(disable).toHaveLength(1);
    expect(disable[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
  });

  it('when the server refuses a change, then its message is shown', async () => {
    stubPeople({
      [`POST /api/users/${rows[2].id}/enable`]: () => apiError(409, 'conflict', 'This account belongs to another programme.'),
    });
    const { user } = renderApp('/admin/people');
    await user.click(await screen.findByRole('button', { name: 'Enable Corin Ashdown' }));
    await user.click(screen.getByRole('button', { name: 'Yes, enable' }));
    expect(await screen.findByText('This account belongs to another programme.')).toBeInTheDocument();
  });

  it('when a person has not set up their account, then the status says so and the action resends the invitation', async () => {
    stubPeople();
    renderApp('/admin/people');
    const row = (await screen.findByText('Fern Oakley')).closest('tr') as HTMLElement;
    expect(within(row).getByText('Invited, not set up yet')).toBeInTheDocument();
    expect(within(row).getByRole('button', { name: 'Resend invitation for Fern Oakley' })).toBeInTheDocument();
    // Never offered for one's own account (that is "Change my password") or a disabled one.
    const mine = screen.getByText(me.email).closest('tr') as HTMLElement;
    expect(within(mine).queryByRole('button', { name: /set-up link|invitation/ })).not.toBeInTheDocument();
    const disabled = screen.getByText('Corin Ashdown').closest('tr') as HTMLElement;
    expect(within(disabled).queryByRole('button', { name: /set-up link|invitation/ })).not.toBeInTheDocument();
  });

  it('when "New set-up link" is confirmed, then the request is sent with the CSRF token and the result is announced; no password is shown', async () => {
    const sent: FakeRequest[] = [];
    stubPeople({
      [`POST /api/users/${rows[1].id}/setup-link`]: (request) => {
        sent.push(request);
        return json(202, { user: { ...rows[1], passwordSet: false } });
      },
    });
    const { user } = renderApp('/admin/people');
    await user.click(await screen.findByRole('button', { name: 'New set-up link for Ada Pennick' }));
    expect(screen.getByText(/Their password stops working and they are signed out everywhere/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Yes, send it' }));
    expect(await screen.findByText('A new set-up link is on its way to Ada Pennick.')).toBeInTheDocument();
    expect(sent).toHaveLength(1);
    expect(sent[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
  });
});
