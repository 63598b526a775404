import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { apiError, json, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const GENERIC = 'That e-mail and password do not match an active account.';

async function fillAndSubmit(user: ReturnType<typeof renderApp>['user'], email = 'Nurse@Larkmoor.example') {
  await user.type(await screen.findByLabelText('E-mail'), email);
  await user.type(screen.getByLabelText('Password'), 'wrong horse battery');
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('sign-in', () => {
  it('when the credentials are refused, then shows the one generic message and keeps what was typed', async () => {
    stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/session': () => apiError(401, 'invalid_credentials', GENERIC),
    });
    const { user, router } = renderApp('/sign-in');
    await fillAndSubmit(user);

    expect(await screen.findByRole('region', { name: 'There is a problem' })).toHaveTextContent(GENERIC);
    expect(screen.getByLabelText('E-mail')).toHaveValue('Nurse@Larkmoor.example');
    expect(screen.getByLabelText('Password')).toHaveValue('wrong horse battery');
    expect(currentUrl(router)).toBe('/sign-in');
  });

  it('when a sign-in is on its way, then the button is disabled so it cannot be sent twice', async () => {
    const fetchMock = stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/session': () => new Promise<Response>(() => {}),
    });
    const { user } = renderApp('/sign-in');
    await fillAndSubmit(user);

    const button = await screen.findByRole('button', { name: 'Signing in…' });
    expect(button).toBeDisabled();
    await user.click(button);
    expect(fetchMock.mock.calls.filter(([, init]) => init?.method === 'POST')).toHaveLength(1);
  });

  it('when rate-limited, then shows the server message', async () => {
    stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/session': () => apiError(429, 'rate_limited', 'Too many attempts. Wait 15 minutes and try again.'),
    });
    const { user } = renderApp('/sign-in');
    await fillAndSubmit(user);
    expect(await screen.findByRole('region', { name: 'There is a problem' })).toHaveTextContent('Too many attempts. Wait 15 minutes and try again.');
  });

  it('when fields are empty, then explains beside each field and sends nothing', async () => {
    const fetchMock = stubApi({ 'GET /api/session': sessionHandler(null) });
    const { user } = renderApp('/sign-in');
    await user.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });

  it('when accepted, then sends the CSRF token and lands on the page first asked for', async () => {
    const seen: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler(null, 'csrf-anon'),
      'POST /api/session': (request) => {
        seen.push(request);
        return json(200, { user: sessionUser('admin'), csrfToken: 'csrf-admin' });
      },
      'GET /api/users': () => json(200, { items: [], total: 0 }),
    });
    const { user, router } = renderApp('/sign-in?next=%2Fadmin%2Fpeople');
    await fillAndSubmit(user, 'admin@larkmoor.example');

    expect(await screen.findByRole('heading', { level: 1, name: 'People' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/admin/people');
    expect(seen[0].headers.get('X-CSRF-Token')).toBe('csrf-anon');
    expect(seen[0].body).toEqual({ email: 'admin@larkmoor.example', password: 'wrong horse battery' });
  });

  it('when the requested page belongs to another role, then lands on the role home instead', async () => {
    stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/session': () => json(200, { user: sessionUser('family'), csrfToken: 'csrf-family' }),
    });
    const { user, router } = renderApp('/sign-in?next=%2Fadmin%2Fpeople');
    await fillAndSubmit(user);
    await waitFor(() => expect(currentUrl(router)).toBe('/family'));
    expect(await screen.findByRole('heading', { level: 1, name: 'Our plan' })).toBeInTheDocument();
  });
});
