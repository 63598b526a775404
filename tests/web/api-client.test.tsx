import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { apiRequest, configureApiClient } from '../../web/lib/api-client';
import { ApiError } from '../../web/lib/api-error';
import { apiError, json, stubApi } from './support/fake-api';

const onUnauthenticated = vi.fn();

function configure(token = 'token-a', fresh = 'token-b') {
  configureApiClient({
    getCsrfToken: async () => token,
    refreshCsrfToken: async () => fresh,
    onUnauthenticated,
  });
}

const headerOf = (call: unknown[] | undefined, name: string) => new Headers((call?.[1] as RequestInit)?.headers).get(name);

afterEach(() => onUnauthenticated.mockReset());

describe('api client', () => {
  it('when writing, then X-CSRF-Token is sent; when reading, then it is not', async () => {
    configure();
    const fetchMock = stubApi({ 'GET /api/things': () => json(200, {}), 'POST /api/things': () => json(201, {}), 'DELETE /api/things': () => json(204) });
    await apiRequest('/api/things');
    await apiRequest('/api/things', { method: 'POST', body: { a: 1 } });
    await apiRequest('/api/things', { method: 'DELETE' });

    expect(headerOf(fetchMock.mock.calls[0], 'X-CSRF-Token')).toBeNull();
    expect(headerOf(fetchMock.mock.calls[1], 'X-CSRF-Token')).toBe('token-a');
    expect(headerOf(fetchMock.mock.calls[2], 'X-CSRF-Token')).toBe('token-a');
    expect((fetchMock.mock.calls[1][1] as RequestInit).credentials).toBe('same-origin');
  });

  it('when the server answers the error shape, then an ApiError carries status, code, message and details', async () => {
    configure();
    stubApi({ 'POST /api/users': () => apiError(400, 'validation_failed', 'Check the fields.', { email: ['Enter a valid e-mail address'] }) });
    const error = await apiRequest('/api/users', { method: 'POST', body: {} }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'validation_failed', message: 'Check the fields.', details: { email: ['Enter a valid e-mail address'] } });
  });

  it('when a proxy answers without the error shape, then a readable ApiError still comes back', async () => {
    configure();
    stubApi({ 'GET /api/health': () => new Response('<html>Bad gateway</html>', { status: 502 }) });
    await expect(apiRequest('/api/health')).rejects.toMatchObject({ status: 502, code: 'http_502' });
  });

  it('when the CSRF token is refused, then one retry goes out with a fresh token', async () => {
    configure('stale', 'fresh');
    const fetchMock = stubApi({
      'POST /api/things': ({ headers }) =>
        headers.get('X-CSRF-Token') === 'fresh' ? json(200, { ok: true }) : apiError(403, 'csrf_invalid', 'Refresh and try again.'),
    });
    await expect(apiRequest('/api/things', { method: 'POST', schema: z.object({ ok: z.boolean() }) })).resolves.toEqual({ ok: true });
    expect(fetchMock).toHaveBeenCalledTimes(2);
  });

  it('when a protected call answers 401, then the sign-out handler runs, unless the call opted out', async () => {
    configure();
    stubApi({ 'GET /api/users': () => apiError(401, 'unauthenticated', 'Sign in again.'), 'POST /api/session': () => apiError(401, 'invalid_credentials', 'No.') });
    await expect(apiRequest('/api/users')).rejects.toMatchObject({ status: 401 });
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);
    await expect(apiRequest('/api/session', { method: 'POST', body: {}, redirectOn401: false })).rejects.toMatchObject({ code: 'invalid_credentials' });
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);
  });

  it('when the answer does not match the shared schema, then the call fails instead of passing bad data on', async () => {
    configure();
    stubApi({ 'GET /api/health': () => json(200, { status: 'fine' }) });
    const schema = z.object({ status: z.enum(['ok', 'degraded']) });
    await expect(apiRequest('/api/health', { schema })).rejects.toMatchObject({ code: 'unexpected_response' });
  });

  it('when query values are empty, then they are left out of the URL', async () => {
    configure();
    const fetchMock = stubApi({ 'GET /api/users': () => json(200, {}) });
    await apiRequest('/api/users', { query: { page: 2, q: '', role: undefined } });
    expect(fetchMock.mock.calls[0][0]).toBe('/api/users?page=2');
  });
});
