import type { Request } from 'express';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { SessionService } from '../modules/session/session.service';
import { accountReadWithSession } from './session-middleware';

/** One Passport instance per app, so tests can build several apps in one process. */
export function createPassport(sessions: SessionService) {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', passReqToCallback: true }, (req, email, password, done) => {
      sessions.authenticate(email, password, req.ip ?? null).then((user) => done(null, user), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // A disabled or deleted account deserialises to nothing, which signs the session out on its next request. The
  // session store has usually read the account with the session already (same statement); otherwise it is read here.
  passport.deserializeUser((req: Request, id: string, done: (err: unknown, user?: Express.User | false) => void) => {
    const read = accountReadWithSession(req);
    if (read !== undefined) return done(null, read && read.id === id ? read : false);
    sessions.loadSessionUser(id).then((user) => done(null, user ?? false), done);
  });
  return passport;
}
export type AppPassport = ReturnType<typeof createPassport>;
