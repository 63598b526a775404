import { vi } from 'vitest';
import type { Role } from '@shared/auth/roles';
import type { SessionUser } from '@shared/schemas/session';
import type { User } from '@shared/schemas/users';

export interface FakeRequest {
  url: URL;
  method: string;
  body: unknown;
  headers: Headers;
}
type Handler = (request: FakeRequest) => Response | Promise<Response>;

export const PROGRAMME_ID = '6f1d2c3b-4a59-4e8d-9c7b-1a2b3c4d5e6f';

export function json(status: number, body?: unknown): Response {
  if (body === undefined) return new Response(null, { status });
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

export const apiError = (status: number, code: string, message: string, details?: Record<string, string[]>) =>
  json(status, { error: { code, message, ...(details ? { details } : {}) } });

/** Replaces fetch for one test; unmatched calls answer 404 in the API's own error shape. */
export function stubApi(routes: Record<string, Handler>) {
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input), 'http://localhost');
    const method = init?.method ?? 'GET';
    const handler = routes[`${method} ${url.pathname}`];
    if (!handler) return apiError(404, 'not_found', `No stub for ${method} ${url.pathname}`);
    const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    return handler({ url, method, body, headers: new Headers(init?.headers) });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

const NAMES: Record<Role, string> = {
  admin: 'Maren Holloway',
  coordinator: 'Tobias Fenwick',
  nurse: 'Ada Pennick',
  consultant: 'Dr Ilse Varga',
  family: 'Rosa Quill',
};

export function sessionUser(role: Role): SessionUser {
  return {
    id: `0000000${ROLE_INDEX[role]}-1111-4111-8111-111111111111`,
    email: `${role}@larkmoor.example`,
    name: NAMES[role],
    role,
    programmeId: PROGRAMME_ID,
    programmeName: "Larkmoor Children's Home Oxygen Service",
    programmeTimeZone: 'Europe/London',
    programmeCountry: 'GB',
  };
}
const ROLE_INDEX: Record<Role, number> = { admin: 1, coordinator: 2, nurse: 3, consultant: 4, family: 5 };

export const sessionHandler = (role: Role | null, csrfToken = 'csrf-1'): Handler => () =>
  json(200, { user: role ? sessionUser(role) : null, csrfToken });

let seq = 0;
export function makeUser(overrides: Partial<User> = {}): User {
  seq += 1;
  return {
    id: `9a9a9a9a-0000-4000-8000-${String(seq).padStart(12, '0')}`,
    email: `person${seq}@larkmoor.example`,
    name: `Person ${seq}`,
    role: 'nurse',
    programmeId: PROGRAMME_ID,
    disabled: false,
    passwordSet: true,
    createdAt: '2025-03-02T09:00:00.000Z',
    lastSignInAt: null,
    ...overrides,
  };
}
