import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SKIP_REASONS, type Message } from '@shared/schemas/messages';
import { apiError, json, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

// The first visit loads the lazy page module; with every web test file running at once that can take a few seconds.
configure({ asyncUtilTimeout: 5000 });

const BABY = { id: 'a1a1a1a1-0000-4000-8000-000000000071', name: 'Juniper Ashcombe' };

function message(n: number, overrides: Partial<Message> = {}): Message {
  return {
    id: `e7e7e7e7-0000-4000-8000-${String(n).padStart(12, '0')}`,
    template: 'visit-day-before',
    channel: 'sms',
    status: 'sent',
    reason: null,
    recipient: { kind: 'family', name: 'Rosa Quill', address: '+447700900123' },
    infant: BABY,
    sendAt: '2026-07-01T16:00:00.000Z',
    sentAt: '2026-07-01T16:00:02.000Z',
    attempts: 1,
    providerId: 'SM-0001',
    lastError: null,
    createdAt: '2026-06-30T09:00:00.000Z',
    ...overrides,
  };
}

const ROWS: Message[] = [
  message(1),
  message(2, {
    status: 'failed', channel: 'email', template: 'visit-morning', sentAt: null, attempts: 3, providerId: null,
    recipient: { kind: 'family', name: 'Corin Ashdown', address: 'corin@larkmoor.example' }, lastError: 'Mailbox unavailable (550)',
  }),
  message(3, { status: 'skipped', channel: null, reason: 'quiet-hours', sentAt: null, attempts: 0, providerId: null, template: 'visit-moved' }),
  message(4, {
    template: 'nurse-digest', infant: null, status: 'scheduled', sentAt: null, attempts: 0, providerId: null, channel: 'email',
    recipient: { kind: 'staff', name: 'Ada Pennick', address: 'ada.pennick@larkmoor.example' },
  }),
];

function stubLog(options: { rows?: () => Message[]; total?: number; totalIsEstimate?: boolean; extra?: Record<string, (request: FakeRequest) => Response> } = {}) {
  const listCalls: URLSearchParams[] = [];
  const fetchMock = stubApi({
    'GET /api/session': sessionHandler('admin'),
    'GET /api/messages': ({ url }) => {
      listCalls.push(url.searchParams);
      const items = options.rows ? options.rows() : ROWS;
      const total = options.total ?? items.length;
      // Cursors name the page they sit beside, so a test can see which one was sent.
      const page = Number(url.searchParams.get('page') ?? 1);
      const more = page * Number(url.searchParams.get('pageSize') ?? 25) < total;
      return json(200, { items, total, totalIsEstimate: options.totalIsEstimate ?? false, nextCursor: more ? `after-${page}` : null, prevCursor: page > 1 ? `before-${page}` : null });
    },
    ...options.extra,
  });
  return { listCalls, fetchMock };
}

const bodyRows = async () => within(await screen.findByRole('table')).getAllByRole('row').slice(1);

describe('Message log', () => {
  it('when the log answers, then each message is a row with programme-local time, recipient, channel, type, status in words and baby', async () => {
    stubLog();
    renderApp('/messages');
    const rows = await bodyRows();
    expect(rows).toHaveLength(4);

    const sent = within(rows[0]);
    // 16:00 UTC on 1 July is 17:00 in London (British Summer Time): the programme's clock, not UTC.
    expect(sent.getByText('1 Jul 2026, 17:00')).toBeInTheDocument();
    expect(sent.getByText('Rosa Quill')).toBeInTheDocument();
    // Stored in E.164, shown as people in the programme's country (GB) write it.
    expect(sent.getByText('07700 900123')).toBeInTheDocument();
    expect(sent.getByText('Family · SMS')).toBeInTheDocument();
    expect(sent.getByText('Visit tomorrow (family)')).toBeInTheDocument();
    expect(sent.getByText('Sent')).toBeInTheDocument();
    expect(sent.getByText('SM-0001')).toBeInTheDocument();
    expect(sent.getByRole('link', { name: 'Juniper Ashcombe' })).toHaveAttribute('href', `/infants/${BABY.id}`);
    expect(sent.queryByRole('button', { name: /Send again/ })).not.toBeInTheDocument();

    const failed = within(rows[1]);
    expect(failed.getByText('Failed')).toBeInTheDocument();
    expect(failed.getByText('Mailbox unavailable (550)')).toBeInTheDocument();
    expect(failed.getByText('Family · E-mail')).toBeInTheDocument();
    expect(failed.getByText('3 attempts')).toBeInTheDocument();
    expect(failed.getByRole('button', { name: /Send again/ })).toBeInTheDocument();

    const skipped = within(rows[2]);
    expect(skipped.getByText('Not sent')).toBeInTheDocument();
    expect(skipped.getByText(SKIP_REASONS['quiet-hours'])).toBeInTheDocument();
    // Skipped before any channel was chosen: no channel is named.
    expect(skipped.getByText('Family')).toBeInTheDocument();

    const digest = within(rows[3]);
    expect(digest.getByText("Nurse's morning list")).toBeInTheDocument();
    expect(digest.getByText(/^Staff/)).toBeInTheDocument();
    expect(digest.getByText('Waiting to send')).toBeInTheDocument();
    expect(digest.queryByRole('link')).not.toBeInTheDocument();
    expect(screen.getByText('Page 1 of 1 · 4 messages')).toBeInTheDocument();
  });

  it('when an e-mail\'s outcome is unknown, then the row says to check before sending again and still offers it', async () => {
    stubLog({ rows: () => [message(5, { status: 'unknown', channel: 'email', reason: 'Outcome unknown — check before sending again', sentAt: null, attempts: 2, providerId: null, lastError: 'No mail search is configured to check' })] });
    renderApp('/messages');
    const [row] = await bodyRows();
    expect(within(row).getByText('Outcome unknown — check before sending again')).toBeInTheDocument();
    expect(within(row).getByText('It may already have reached them (No mail search is configured to check).')).toBeInTheDocument();
    expect(within(row).getByRole('button', { name: /Send again/ })).toBeInTheDocument();
  });

  it('when the coordinator records that an unknown-outcome message arrived, then it is posted with the CSRF token and the row reads sent', async () => {
    const unknown = message(6, { status: 'unknown', channel: 'email', sentAt: null, providerId: null, lastError: null });
    const posts: FakeRequest[] = [];
    stubLog({
      rows: () => [posts.length ? { ...unknown, status: 'sent' as const } : unknown],
      extra: { [`POST /api/messages/${unknown.id}/arrived`]: (request) => (posts.push(request), json(200, { message: { ...unknown, status: 'sent' } })) },
    });
    const { user } = renderApp('/messages');
    const [row] = await bodyRows();
    await user.click(within(row).getByRole('button', { name: 'It arrived: Rosa Quill' }));
    await waitFor(() => expect(posts).toHaveLength(1));
    expect(posts[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect(await screen.findByText('Recorded: the message reached Rosa Quill. It will not be sent again.')).toBeInTheDocument();
    const [after] = await bodyRows();
    await waitFor(() => expect(within(after).getByText('Sent')).toBeInTheDocument());
  });

  it('when "Send again" is pressed, then the retry is posted with the CSRF token, a toast confirms it and the list is read again', async () => {
    let retried = false;
    const posts: FakeRequest[] = [];
    const { listCalls } = stubLog({
      rows: () => (retried ? [ROWS[0], { ...ROWS[1], status: 'scheduled', lastError: null }] : [ROWS[0], ROWS[1]]),
      extra: {
        [`POST /api/messages/${ROWS[1].id}/retry`]: (request) => {
          posts.push(request);
          retried = true;
          return json(200, { message: { ...ROWS[1], status: 'scheduled', lastError: null } });
        },
      },
    });
    const { user } = renderApp('/messages');
    const rows = await bodyRows();
    const callsBefore = listCalls.length;
    await user.click(within(rows[1]).getByRole('button', { name: 'Send again to Corin Ashdown' }));

    await waitFor(() => expect(posts).toHaveLength(1));
    expect(posts[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect(posts[0].body).toBeUndefined();
    expect(await screen.findByText('The message to Corin Ashdown will be sent again.')).toBeInTheDocument();
    await waitFor(() => expect(listCalls.length).toBeGreaterThan(callsBefore));
    const after = await bodyRows();
    await waitFor(() => expect(within(after[1]).getByText('Waiting to send')).toBeInTheDocument());
    expect(within(after[1]).queryByRole('button', { name: /Send again/ })).not.toBeInTheDocument();
  });

  it('when the retry is refused, then the reason is shown and the list is read again to show the row as it is now', async () => {
    let refused = false;
    const { listCalls } = stubLog({
      rows: () => (refused ? [{ ...ROWS[1], status: 'sent', lastError: null, providerId: 'EM-0002' }] : [ROWS[1]]),
      extra: {
        [`POST /api/messages/${ROWS[1].id}/retry`]: () => {
          refused = true;
          return apiError(409, 'conflict', 'This message is no longer failed, so it cannot be sent again.');
        },
      },
    });
    const { user } = renderApp('/messages');
    const [row] = await bodyRows();
    const callsBefore = listCalls.length;
    await user.click(within(row).getByRole('button', { name: /Send again/ }));
    expect(await screen.findByText('This message is no longer failed, so it cannot be sent again.')).toBeInTheDocument();
    await waitFor(() => expect(listCalls.length).toBeGreaterThan(callsBefore));
    expect(await screen.findByText('EM-0002')).toBeInTheDocument();
  });

  it('when a filter is chosen or a header clicked, then the view goes into the URL and the request, starting again at page 1', async () => {
    const { listCalls } = stubLog({ total: 60 });
    const { user, router } = renderApp('/messages?page=2');
    await screen.findByRole('table');
    expect(screen.getByRole('columnheader', { name: /Send time/ })).toHaveAttribute('aria-sort', 'descending');

    await user.selectOptions(screen.getByLabelText('Status'), 'Failed');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?status=failed'));
    await user.selectOptions(screen.getByLabelText('Channel'), 'E-mail');
    await user.selectOptions(screen.getByLabelText('Message type'), 'Visit moved (family)');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?status=failed&channel=email&template=visit-moved'));
    await waitFor(() => expect(Object.fromEntries(listCalls.at(-1)!)).toEqual({
      page: '1', pageSize: '25', sort: '-sendAt', status: 'failed', channel: 'email', template: 'visit-moved', direction: 'next',
    }));

    await user.click(screen.getByRole('button', { name: /^Status/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?sort=status&status=failed&channel=email&template=visit-moved'));
    await waitFor(() => expect(listCalls.at(-1)?.get('sort')).toBe('status'));
  });

  it('when pages are turned, then each asks for the rows beside the last page, back to page 1 is the plain first page, and a filter, the sort, the page size or the search starts again', async () => {
    const { listCalls } = stubLog({ total: 60 });
    const { user, router } = renderApp('/messages?channel=sms');
    await screen.findByRole('table');
    expect(screen.getByRole('button', { name: 'Previous page' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=2&channel=sms&cursor=after-1'));
    await waitFor(() => expect(Object.fromEntries(listCalls.at(-1)!)).toEqual({ page: '2', pageSize: '25', sort: '-sendAt', channel: 'sms', cursor: 'after-1', direction: 'next' }));
    await user.click(await screen.findByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=3&channel=sms&cursor=after-2'));
    await waitFor(() => expect(screen.getByText('Page 3 of 3 · 60 messages')).toBeInTheDocument());
    expect(screen.getByRole('button', { name: 'Next page' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Previous page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=2&channel=sms&cursor=before-3&direction=prev'));
    await waitFor(() => expect(listCalls.at(-1)?.get('direction')).toBe('prev'));
    await user.click(await screen.findByRole('button', { name: 'Previous page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?channel=sms'));

    // A cursor belongs to the list it came from: a filter, the search or a new sort starts again from page 1.
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=2&channel=sms&cursor=after-1'));
    await user.selectOptions(screen.getByLabelText('Status'), 'Failed');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?status=failed&channel=sms'));
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=2&status=failed&channel=sms&cursor=after-1'));
    await user.click(screen.getByRole('button', { name: /^Send time/ }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?sort=sendAt&status=failed&channel=sms'));
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=2&sort=sendAt&status=failed&channel=sms&cursor=after-1'));
    await user.selectOptions(screen.getByLabelText('Rows per page'), '50');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?pageSize=50&sort=sendAt&status=failed&channel=sms'));
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?page=2&pageSize=50&sort=sendAt&status=failed&channel=sms&cursor=after-1'));
    await user.type(screen.getByRole('searchbox', { name: 'Search by baby, name or number' }), 'Rosa{Enter}');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?pageSize=50&sort=sendAt&status=failed&channel=sms&q=Rosa'));
    await waitFor(() => expect(Object.fromEntries(listCalls.at(-1)!)).toEqual({ page: '1', pageSize: '50', sort: 'sendAt', status: 'failed', channel: 'sms', q: 'Rosa', direction: 'next' }));
  });

  it('when the log is very large, then the total is given as "about"', async () => {
    stubLog({ total: 214_380, totalIsEstimate: true });
    renderApp('/messages');
    expect(await screen.findByText('Page 1 of about 8,576 · about 214,380 messages')).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Messages, about 214380 in all' })).toBeInTheDocument();
  });

  it('when opened from a saved link about one baby, then the view is restored and the narrowing is said and can be cleared', async () => {
    const { listCalls } = stubLog();
    const { user, router } = renderApp(`/messages?pageSize=10&sort=sendAt&channel=sms&infantId=${BABY.id}`);
    await screen.findByRole('table');
    expect(Object.fromEntries(listCalls[0])).toEqual({ page: '1', pageSize: '10', sort: 'sendAt', channel: 'sms', infantId: BABY.id, direction: 'next' });
    expect(screen.getByLabelText('Channel')).toHaveValue('sms');
    expect(screen.getByText('Showing messages about one baby only.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Show every baby' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?pageSize=10&sort=sendAt&channel=sms'));
  });

  it('when nothing matches the filters, then the page says so in words', async () => {
    stubLog({ rows: () => [] });
    renderApp('/messages?status=failed');
    expect(await screen.findByText('No message matches this search and these filters.')).toBeInTheDocument();
  });

  it('when a coordinator signs in, then the menu offers the log and the empty log says so in words', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator'), 'GET /api/messages': () => json(200, { items: [], total: 0 }) });
    renderApp('/messages');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Messages' })).toHaveAttribute('aria-current', 'page');
    expect(await screen.findByText('No messages yet: reminders show here as soon as they are planned.')).toBeInTheDocument();
  });

  it('when a nurse opens the log, then it is not offered', async () => {
    stubApi({ 'GET /api/session': sessionHandler('nurse') });
    renderApp('/messages');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not part of your work' })).toBeInTheDocument();
  });

  it('when the coordinator types in the search box, then after a pause the log is searched by that text, once, and the URL keeps it', async () => {
    const { listCalls } = stubLog();
    const { user, router } = renderApp('/messages');
    await bodyRows();
    const box = screen.getByRole('searchbox', { name: 'Search by baby, name or number' });
    await user.type(box, 'Juniper');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?q=Juniper'));
    await waitFor(() => expect(listCalls.at(-1)?.get('q')).toBe('Juniper'));
    // One search for the word, not one per letter.
    expect(listCalls.filter((p) => p.get('q')).map((p) => p.get('q'))).toEqual(['Juniper']);
    // Enter searches at once; clearing the box shows everything again.
    await user.clear(box);
    await user.type(box, '07700 900123{Enter}');
    await waitFor(() => expect(currentUrl(router)).toBe('/messages?q=07700+900123'));
  });

  it('when filters and a search are set, then "Download CSV" asks for the same messages without paging', async () => {
    stubLog({ total: 80 });
    const { user } = renderApp('/messages?page=2&sort=sendAt');
    await bodyRows();
    expect(screen.getByRole('link', { name: 'Download CSV' })).toHaveAttribute('href', '/api/messages.csv?sort=sendAt');
    await user.selectOptions(screen.getByLabelText('Status'), 'Failed');
    await user.type(screen.getByRole('searchbox', { name: 'Search by baby, name or number' }), 'Juniper');
    await waitFor(() => expect(screen.getByRole('link', { name: 'Download CSV' })).toHaveAttribute('href', '/api/messages.csv?sort=sendAt&status=failed&q=Juniper'));
  });
});
