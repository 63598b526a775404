import type { SessionUser } from '../../../shared/schemas/session';
import { burnVerifyTime, verifyPassword } from '../../auth/passwords';
import type { SignInLimiter } from '../../auth/sign-in-limiter';
import type { AuditRepository } from '../../db/repositories/audit.repository';
import type { UserWithProgramme, UsersRepository } from '../../db/repositories/users.repository';
import { AppError } from '../../lib/errors';

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
});

interface Deps {
  users: UsersRepository;
  audit: AuditRepository;
  limiter: SignInLimiter;
}

export function createSessionService({ users, audit, limiter }: Deps) {
  return {
    async authenticate(email: string, password: string, ip: string | null): Promise<SessionUser> {
      await limiter.beforeAttempt(email, ip ?? 'unknown');
      const user = await users.findByEmail(email);
      const ok = user ? await verifyPassword(user.passwordHash, password) : (await burnVerifyTime(password), false);
      if (!user || !ok || user.disabled) {
        await limiter.failed(email);
        await audit.append({
          programmeId: user?.programmeId ?? null,
          actorId: null,
          action: 'session.sign_in_failed',
          entityType: 'user',
          entityId: user?.id ?? null,
          details: { reason: !user ? 'unknown_account' : user.disabled ? 'disabled' : 'wrong_password' },
          ip,
        });
        throw new InvalidCredentialsError();
      }
      await limiter.succeeded(email);
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
