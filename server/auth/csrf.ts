import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Request, Response } from 'express';
import { csrfSync } from 'csrf-sync';

export const PRE_SESSION_CSRF_COOKIE = 'nestflow.csrf';

function readCookie(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return undefined;
}

/**
 * CSRF tokens: a signed-in session keeps its synchroniser token in the stored session (csrf-sync's default). A
 * signed-out visitor (the sign-in and set-password forms) gets a signed double-submit cookie instead, so that
 * opening the sign-in page stores nothing on the server: the token in the header must equal the one in the cookie,
 * and the cookie must carry our HMAC of it, so a cookie planted from elsewhere is refused.
 */
export function createCsrf(secret: string, secureCookie: boolean) {
  const sign = (token: string) => createHmac('sha256', secret).update(`nestflow-pre-session-csrf:${token}`).digest('base64url');

  const fromCookie = (req: Request): string | undefined => {
    const value = readCookie(req, PRE_SESSION_CSRF_COOKIE);
    const dot = value?.lastIndexOf('.') ?? -1;
    if (!value || dot < 1) return undefined;
    const token = value.slice(0, dot);
    const given = Buffer.from(value.slice(dot + 1));
    const expected = Buffer.from(sign(token));
    return given.length === expected.length && timingSafeEqual(given, expected) ? token : undefined;
  };

  const cookieOptions = { httpOnly: true, sameSite: 'strict' as const, secure: secureCookie, path: '/api' };

  return csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token'),
    getTokenFromState: (req) => (req.user ? req.session.csrfToken : fromCookie(req)),
    storeTokenInState: (req, token) => {
      if (req.user) {
        req.session.csrfToken = token;
        return;
      }
      if (token) req.res?.cookie(PRE_SESSION_CSRF_COOKIE, `${token}.${sign(token)}`, cookieOptions);
      else req.res?.clearCookie(PRE_SESSION_CSRF_COOKIE, cookieOptions);
    },
    size: 32,
  });
}

/** After sign-in the session holds the token; the pre-session cookie has done its job. */
export function clearPreSessionCsrf(res: Response) {
  res.clearCookie(PRE_SESSION_CSRF_COOKIE, { httpOnly: true, sameSite: 'strict', path: '/api' });
}
