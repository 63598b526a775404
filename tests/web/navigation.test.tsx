import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const cases: { role: Role; home: string; heading: string; items: string[] }[] = [
  { role: 'admin', home: '/admin', heading: 'Overview', items: ['Overview', 'People', 'Programme settings', 'Messages'] },
  { role: 'coordinator', home: '/coordinator', heading: 'Overview', items: ['Overview', 'Caseload', 'Enrol a baby', 'Messages', 'Equipment orders'] },
  { role: 'nurse', home: '/nurse', heading: 'My day', items: ['My day', 'Caseload'] },
  { role: 'consultant', home: '/consultant', heading: 'Overview', items: ['Overview', 'Sign-off queue', 'Caseload'] },
  { role: 'family', home: '/family', heading: 'Our plan', items: ['Our plan'] },
];

describe('role navigation', () => {
  it.each(cases)('when a $role signs in, then / leads to $home and the menu offers only their work', async ({ role, home, heading, items }) => {
    stubApi({
      'GET /api/session': sessionHandler(role),
      'GET /api/health/ready': () => json(200, { status: 'ok', db: 'ok', redis: 'ok', migrations: 'current', workers: { status: 'ok', running: 1, seen: [] } }),
    });
    const { router } = renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: heading })).toBeInTheDocument();
    expect(currentUrl(router)).toBe(home);
    const nav = screen.getByRole('navigation', { name: 'Main' });
    const labels = within(nav).getAllByRole('link').map((link) => link.textContent);
    expect(labels).toEqual(items);
    expect(within(nav).getByRole('link', { name: items[0] })).toHaveAttribute('aria-current', 'page');
  });

  it('when a person opens a page of another role, then it says so and offers their home', async () => {
    stubApi({ 'GET /api/session': sessionHandler('nurse') });
    renderApp('/admin/people');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not part of your work' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to your home page' })).toHaveAttribute('href', '/nurse');
  });

  it('when signed out, then a protected page sends the visitor to sign-in and remembers the page', async () => {
    stubApi({ 'GET /api/session': sessionHandler(null) });
    const { router } = renderApp('/caseload');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/sign-in?next=%2Fcaseload');
  });

  it('when the header is shown, then it names the programme, the person and their role', async () => {
    stubApi({ 'GET /api/session': sessionHandler('consultant') });
    renderApp('/consultant');
    const banner = await screen.findByRole('banner');
    expect(within(banner).getByText("Larkmoor Children's Home Oxygen Service")).toBeInTheDocument();
    expect(within(banner).getAllByText('Dr Ilse Varga').length).toBeGreaterThan(0);
    expect(within(banner).getAllByText(/Consultant/).length).toBeGreaterThan(0);
  });

  it('when the person signs out, then the session ends with the CSRF token and plain sign-in is shown, naming no page', async () => {
    let signedOut = false;
    const fetchMock = stubApi({
      'GET /api/session': (request) => sessionHandler(signedOut ? null : 'coordinator', signedOut ? 'csrf-2' : 'csrf-1')(request),
      'DELETE /api/session': () => {
        signedOut = true;
        return json(204);
      },
    });
    const { user, router } = renderApp('/coordinator');
    await user.click(await screen.findByRole('button', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    // Not /sign-in?next=%2Fcoordinator: a session that ran out keeps the page, a deliberate sign-out does not.
    expect(currentUrl(router)).toBe('/sign-in');
    const deleteCall = fetchMock.mock.calls.find(([, init]) => init?.method === 'DELETE');
    expect(new Headers(deleteCall?.[1]?.headers).get('X-CSRF-Token')).toBe('csrf-1');
    await waitFor(() => expect(screen.queryByRole('navigation', { name: 'Main' })).not.toBeInTheDocument());
  });
});
