import { Router, type Request, type Response, type NextFunction } from 'express';
import type { CsrfSync } from 'csrf-sync';
import { signInSchema, type SessionUser } from '@shared/schemas/session';
import { validate } from '../../middleware/validate';
import type { AppPassport } from '../../auth/passport';
import { SESSION_COOKIE } from '../../auth/session-middleware';
import { clearPreSessionCsrf } from '../../auth/csrf';
import type { SessionService } from './session.service';

function authenticate(passport: AppPassport, req: Request, res: Response, next: NextFunction): Promise<SessionUser> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) => {
      if (err) return reject(err);
      if (!user) return reject(new Error('local strategy returned no user'));
      resolve(user);
    })(req, res, next);
  });
}

export function sessionRouter(passport: AppPassport, csrf: CsrfSync, service: SessionService): Router {
  const r = Router();

  r.get('/', (req, res) => {
    res.set('Cache-Control', 'no-store');
    res.json({ user: req.user ?? null, csrfToken: csrf.generateToken(req) });
  });

  r.post('/', validate({ body: signInSchema }), async (req, res, next) => {
    const user = await authenticate(passport, req, res, next);
    // passport's logIn regenerates the session id, so a fixated pre-sign-in id is worthless.
    await new Promise<void>((ok, fail) => req.logIn(user, (e) => (e ? fail(e) : ok())));
    req.session.signedInAt = Date.now();
    clearPreSessionCsrf(res);
    res.set('Cache-Control', 'no-store');
    res.json({ user, csrfToken: csrf.generateToken(req, true) });
  });

  r.delete('/', async (req, res) => {
    const user = req.user;
    await new Promise<void>((ok, fail) => req.logout((e) => (e ? fail(e) : ok())));
    await new Promise<void>((ok, fail) => req.session.destroy((e) => (e ? fail(e) : ok())));
    if (user) await service.signedOut(user, req.ip ?? null);
    res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax' });
    res.status(204).end();
  });
  return r;
}
