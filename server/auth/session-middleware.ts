import type { Request, RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Pool } from 'pg';
import type { SessionUser } from '@shared/schemas/session';
import type { Env } from '../env';
import { createSessionsRepository, type SessionsRepository } from '../db/repositories/sessions.repository';

export const SESSION_COOKIE = 'nestflow.sid';

/** How often one process moves a session's idle expiry on; the idle timeout is kept to within this. */
export const TOUCH_EVERY_MS = 60_000;
const TOUCHED_KEPT = 20_000;

// The account read with the session rides on the raw session object under a symbol: express-session copies only
// enumerable string keys into req.session and hashes only JSON, so it is never saved back or seen as a change.
const ACCOUNT = Symbol('nestflow.session-account');
const ACCOUNT_ON_REQUEST = Symbol('nestflow.request-account');
type WithAccount = { [ACCOUNT]?: SessionUser | null };
type RequestWithAccount = Request & { [ACCOUNT_ON_REQUEST]?: SessionUser | null };

/** The account the session store read along with this request's session: undefined when it did not read one. */
export function accountReadWithSession(req: Request): SessionUser | null | undefined {
  return (req as RequestWithAccount)[ACCOUNT_ON_REQUEST];
}

function createStore(pool: Pool, sessions: SessionsRepository, now: () => number) {
  const PgStore = connectPgSimple(session);
  /**
   * connect-pg-simple with two changes for a request's cost: the session is read together with its account (one
   * statement instead of two), and a busy session's expiry is moved on at most once a minute per process instead of
   * on every request.
   */
  class NestflowSessionStore extends PgStore {
    private readonly touched = new Map<string, number>();

    override get(sid: string, callback: (err: unknown, sess?: session.SessionData | null) => void) {
      sessions.findWithUser(sid, now()).then((found) => {
        if (!found) return callback(null, null);
        Object.defineProperty(found.sess, ACCOUNT, { value: found.user, enumerable: false });
        callback(null, found.sess as unknown as session.SessionData);
      }, (err: unknown) => callback(err));
    }

    override createSession(req: Request, sess: session.SessionData) {
      (req as RequestWithAccount)[ACCOUNT_ON_REQUEST] = (sess as unknown as WithAccount)[ACCOUNT];
      return super.createSession(req, sess);
    }

    override touch(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void) {
      const at = now();
      const last = this.touched.get(sid);
      if (last !== undefined && at - last < TOUCH_EVERY_MS) return callback?.();
      if (this.touched.size >= TOUCHED_KEPT) this.touched.clear();
      this.touched.set(sid, at);
      const expires = sess.cookie?.expires ? new Date(sess.cookie.expires).getTime() : at + (sess.cookie?.maxAge ?? 0);
      sessions.touch(sid, expires).then(() => callback?.(), (err: unknown) => {
        this.touched.delete(sid);
        callback?.(err);
      });
    }

    override destroy(sid: string, callback?: (err?: unknown) => void) {
      this.touched.delete(sid);
      super.destroy(sid, callback);
    }
  }
  return new NestflowSessionStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
}

export function createSessionMiddleware(env: Env, pool: Pool, now: () => number = Date.now): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret: env.SESSION_SECRET,
    store: createStore(pool, createSessionsRepository(pool), now),
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
