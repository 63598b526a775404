import type { RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Pool } from 'pg';
import type { Env } from '../env';

export const SESSION_COOKIE = 'nestflow.sid';

export function createSessionMiddleware(env: Env, pool: Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret: env.SESSION_SECRET,
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    // Rolling cookie = idle timeout; the absolute limit is checked separately from signedInAt.
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: env.COOKIE_SECURE,
      maxAge: env.SESSION_IDLE_MINUTES * 60 * 1000,
    },
  });
}

/** Signs a session out once it is older than the absolute limit, however active it has been. */
export function absoluteTimeout(maxHours: number): RequestHandler {
  return (req, _res, next) => {
    const started = req.session?.signedInAt;
    if (!req.user || !started || Date.now() - started <= maxHours * 3600 * 1000) return next();
    req.session.regenerate((err) => {
      req.user = undefined;
      next(err);
    });
  };
}
