import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { apiError, json, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const TOKEN = 'S3tUpL1nkT0k3nS3tUpL1nkT0k3nS3tUpL1nkT0k3n';
const INFO = { name: 'Fern Oakley', email: 'fern@larkmoor.example', programmeName: "Larkmoor Children's Home Oxygen Service" };

describe('Set-password page (from the e-mailed link)', () => {
  it('when the link is good, then the person is greeted, mismatched or short passwords are caught before sending, and a good one leads to sign in', async () => {
    const sets: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/account/set-password/check': ({ body }) => (body as { token: string }).token === TOKEN ? json(200, INFO) : apiError(400, 'link_invalid', 'x'),
      'POST /api/account/set-password': (request) => {
        sets.push(request);
        return json(200, { email: INFO.email });
      },
    });
    const { user, router } = renderApp(`/set-password?token=${TOKEN}`);
    expect(await screen.findByText(/Hello Fern Oakley/)).toBeInTheDocument();

    await user.type(screen.getByLabelText('New password'), 'short');
    await user.type(screen.getByLabelText('The same password again'), 'shorter');
    await user.click(screen.getByRole('button', { name: 'Save my password' }));
    expect(await screen.findByText('Use at least 12 characters')).toBeInTheDocument();
    expect(screen.getByText('The two passwords are not the same')).toBeInTheDocument();
    expect(sets).toHaveLength(0);

    await user.clear(screen.getByLabelText('New password'));
    await user.clear(screen.getByLabelText('The same password again'));
    await user.type(screen.getByLabelText('New password'), 'lantern moss under the bridge');
    await user.type(screen.getByLabelText('The same password again'), 'lantern moss under the bridge');
    await user.click(screen.getByRole('button', { name: 'Save my password' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/sign-in?passwordSet=1'));
    expect(sets[0].body).toEqual({ token: TOKEN, password: 'lantern moss under the bridge' });
    expect(sets[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect(await screen.findByText('Your password is saved. Sign in with it now.')).toBeInTheDocument();
  });

  it('when the server refuses a common password, then its message sits beside the field', async () => {
    stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/account/set-password/check': () => json(200, INFO),
      'POST /api/account/set-password': () => apiError(400, 'validation_failed', 'Some fields need attention.', { password: ['This password is on a list of common passwords. Choose another.'] }),
    });
    const { user } = renderApp(`/set-password?token=${TOKEN}`);
    await user.type(await screen.findByLabelText('New password'), 'qwerty123456');
    await user.type(screen.getByLabelText('The same password again'), 'qwerty123456');
    await user.click(screen.getByRole('button', { name: 'Save my password' }));
    expect(await screen.findByText('This password is on a list of common passwords. Choose another.')).toBeInTheDocument();
    expect(screen.getByLabelText('New password')).toHaveAttribute('aria-invalid', 'true');
  });

  it('when the link has expired or was used, then the page says so and offers no form', async () => {
    stubApi({
      'GET /api/session': sessionHandler(null),
      'POST /api/account/set-password/check': () => apiError(400, 'link_invalid', 'This set-up link has expired or was already used. Ask your programme admin to send you a new one.'),
    });
    renderApp(`/set-password?token=${TOKEN}`);
    expect(await screen.findByText(/has expired or was already used/)).toBeInTheDocument();
    expect(screen.queryByLabelText('New password')).not.toBeInTheDocument();
  });
});

describe('Change my password', () => {
  it('when a signed-in person changes it, then the current password is sent with the new one, and a wrong current one is shown beside its field', async () => {
    const puts: FakeRequest[] = [];
    let answer = () => apiError(400, 'validation_failed', 'Some fields need attention.', { currentPassword: ['That is not your current password'] });
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      'GET /api/my-day': () => json(200, { date: '2026-12-01', items: [] }),
      'PUT /api/me/password': (request) => {
        puts.push(request);
        return answer();
      },
    });
    const { user } = renderApp('/nurse');
    await user.click(await screen.findByRole('link', { name: 'Change my password' }));
    await user.type(await screen.findByLabelText('Current password'), 'the old one');
    await user.type(screen.getByLabelText('New password'), 'kettle on the windowsill');
    await user.type(screen.getByLabelText('The new password again'), 'kettle on the windowsill');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    expect(await screen.findByText('That is not your current password')).toBeInTheDocument();
    expect(puts[0].body).toEqual({ currentPassword: 'the old one', newPassword: 'kettle on the windowsill' });

    answer = () => json(204);
    await user.clear(screen.getByLabelText('Current password'));
    await user.type(screen.getByLabelText('Current password'), 'the right one');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    expect(await screen.findByText(/Password changed/)).toBeInTheDocument();
    expect(screen.getByLabelText('Current password')).toHaveValue('');
  });
});
