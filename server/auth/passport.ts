import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { SessionService } from '../modules/session/session.service';

/** One Passport instance per app, so tests can build several apps in one process. */
export function createPassport(sessions: SessionService) {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', passReqToCallback: true }, (req, email, password, done) => {
      sessions.authenticate(email, password, req.ip ?? null).then((user) => done(null, user), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // A disabled or deleted account deserialises to nothing, which signs the session out on its next request.
  passport.deserializeUser((id: string, done) => {
    sessions.loadSessionUser(id).then((user) => done(null, user ?? false), done);
  });
  return passport;
}
export type AppPassport = ReturnType<typeof createPassport>;
