import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { apiError, json, sessionHandler, stubApi } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

describe('errors and missing pages', () => {
  it('when the address is unknown, then a not-found page is shown inside the shell', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator') });
    renderApp('/no-such-page');
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeInTheDocument();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeInTheDocument();
  });

  it('when a page load fails with a 5xx, then the error boundary explains it in plain words and the menu stays', async () => {
    // React reports every caught render error on the console; the boundary's output is what is under test.
    vi.spyOn(console, 'error').mockImplementation(() => {});
    vi.spyOn(console, 'warn').mockImplementation(() => {});
    stubApi({
      'GET /api/session': sessionHandler('admin'),
      'GET /api/users': () => apiError(500, 'internal', 'Internal error'),
    });
    renderApp('/admin/people');
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByRole('heading', { name: 'The server had a problem' })).toBeInTheDocument();
    expect(within(alert).getByRole('button', { name: 'Try again' })).toBeInTheDocument();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeInTheDocument();
  });

  it('when the session has expired mid-way, then a 401 sends the person to sign-in', async () => {
    let expired = false;
    stubApi({
      'GET /api/session': (request) => sessionHandler(expired ? null : 'admin')(request),
      'GET /api/users': () => {
        expired = true;
        return apiError(401, 'unauthenticated', 'Sign in again.');
      },
    });
    const { router } = renderApp('/admin/people');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    await waitFor(() => expect(currentUrl(router)).toBe('/sign-in?next=%2Fadmin%2Fpeople'));
  });

  it('when the status check answers, then the admin sees each part in words', async () => {
    stubApi({
      'GET /api/session': sessionHandler('admin'),
      'GET /api/health/ready': () => json(200, { status: 'degraded', db: 'ok', redis: 'down', migrations: 'current', workers: { status: 'missing', running: 0, seen: [] } }),
    });
    renderApp('/admin');
    expect(await screen.findByText('Not reachable')).toBeInTheDocument();
    expect(screen.getByText('Working')).toBeInTheDocument();
    expect(screen.getByText('Not heard from for over a minute')).toBeInTheDocument();
  });
});
