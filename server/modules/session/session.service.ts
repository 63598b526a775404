import type { SessionUser } from '@shared/schemas/session';
import { burnVerifyTime, verifyPassword } from '../../auth/passwords';
import { SignInBlockedError, type SignInLimiter } from '../../auth/sign-in-limiter';
import type { AuditRepository } from '../../db/repositories/audit.repository';
import type { UserWithProgramme, UsersRepository } from '../../db/repositories/users.repository';
import { AppError } from '../../lib/errors';
import type { Logger } from '../../lib/logger';
import { quietly, type AccountMail } from '../../notifications/account-mail';

export class InvalidCredentialsError extends AppError {
  constructor() {
    // One message whatever went wrong, so the answer never tells whether an account exists.
    super(401, 'invalid_credentials', 'That e-mail and password do not match an active account.');
  }
}

export const toSessionUser = (u: UserWithProgramme): SessionUser => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  programmeId: u.programmeId,
  programmeName: u.programmeName,
  programmeTimeZone: u.programmeTimeZone,
  programmeCountry: u.programmeCountry,
});

interface Deps {
  users: UsersRepository;
  audit: AuditRepository;
  limiter: SignInLimiter;
  mail: AccountMail;
  logger: Logger;
  /** Failures of one account (from anywhere) after which its owner is e-mailed, once per account window. */
  alertAfterFailures: number;
}

export function createSessionService({ users, audit, limiter, mail, logger, alertAfterFailures }: Deps) {
  /** Tells the owner their account is being tried: once per window, never holding up the answer. */
  async function maybeAlert(user: UserWithProgramme | null, failures: number) {
    if (!user || user.disabled || failures < alertAfterFailures) return;
    if (!(await limiter.shouldAlert(user.email))) return;
    await audit.append({ programmeId: user.programmeId, actorId: null, action: 'session.owner_alerted', entityType: 'user', entityId: user.id, details: { failures } });
    void mail.signInAttempts({ to: user.email, name: user.name, programmeName: user.programmeName, failures }).catch(quietly(logger, 'sign-in alert'));
  }

  return {
    async authenticate(email: string, password: string, ip: string | null): Promise<SessionUser> {
      const where = ip ?? 'unknown';
      try {
        await limiter.beforeAttempt(email, where);
      } catch (e) {
        if (e instanceof SignInBlockedError) {
          const user = await users.findByEmail(email);
          await audit.append({
            programmeId: user?.programmeId ?? null, actorId: null, action: 'session.sign_in_blocked', entityType: 'user', entityId: user?.id ?? null,
            details: { limit: e.limit, retryAfterSeconds: e.retryAfterSeconds }, ip,
          });
          if (user && e.limit !== 'ip') await maybeAlert(await users.findSessionUser(user.id), alertAfterFailures);
        }
        throw e;
      }
      const user = await users.findByEmail(email);
      const hash = user?.passwordHash ?? null;
      const ok = hash ? await verifyPassword(hash, password) : (await burnVerifyTime(password), false);
      if (!user || !ok || user.disabled) {
        const failures = await limiter.failed(email, where);
        await audit.append({
          programmeId: user?.programmeId ?? null,
          actorId: null,
          action: 'session.sign_in_failed',
          entityType: 'user',
          entityId: user?.id ?? null,
          details: { reason: !user ? 'unknown_account' : user.disabled ? 'disabled' : !hash ? 'not_set_up' : 'wrong_password' },
          ip,
        });
        if (user) await maybeAlert(await users.findSessionUser(user.id), failures);
        throw new InvalidCredentialsError();
      }
      await limiter.succeeded(email, where);
      await users.markSignedIn(user.id);
      await audit.append({ programmeId: user.programmeId, actorId: user.id, action: 'session.signed_in', entityType: 'user', entityId: user.id, ip });
      const full = await users.findSessionUser(user.id);
      return toSessionUser(full!);
    },

    async signedOut(user: SessionUser, ip: string | null) {
      await audit.append({ programmeId: user.programmeId, actorId: user.id, action: 'session.signed_out', entityType: 'user', entityId: user.id, ip });
    },

    async loadSessionUser(id: string): Promise<SessionUser | null> {
      const user = await users.findSessionUser(id);
      return user && !user.disabled ? toSessionUser(user) : null;
    },
  };
}
export type SessionService = ReturnType<typeof createSessionService>;
