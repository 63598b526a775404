import type { DataSource } from 'typeorm';
import type { ChangePasswordInput, SetPasswordInput, SetupLinkInfo } from '@shared/schemas/accounts';
import { hashPassword, verifyPassword } from '../../auth/passwords';
import { passwordProblems } from '../../auth/password-policy';
import { hashSetupToken } from '../../auth/setup-tokens';
import type { SignInLimiter } from '../../auth/sign-in-limiter';
import type { AccountSetupTokenEntity } from '../../db/entities/account-setup-token.entity';
import type { AppRepos } from '../../deps';
import { AppError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';

export class SetupLinkInvalidError extends AppError {
  constructor() {
    // One answer for unknown, used, replaced and expired links: the page offers the same next step for each.
    super(400, 'link_invalid', 'This set-up link has expired or was already used. Ask your programme admin to send you a new one.');
  }
}

interface Deps {
  ds: DataSource;
  repos: Pick<AppRepos, 'users' | 'audit' | 'programmes' | 'accountTokens'>;
  limiter: SignInLimiter;
  now: () => Date;
}

export function createAccountsService({ ds, repos, limiter, now }: Deps) {
  const open = (t: AccountSetupTokenEntity | null) => t && !t.usedAt && !t.revokedAt && t.expiresAt.getTime() > now().getTime() ? t : null;

  return {
    /** Who the link is for, so the page can greet them; refuses a link that can no longer be used. */
    async checkLink(token: string): Promise<SetupLinkInfo> {
      const t = open(await repos.accountTokens.findByHash(hashSetupToken(token)));
      const user = t ? await repos.users.findSessionUser(t.userId) : null;
      if (!t || !user || user.disabled) throw new SetupLinkInvalidError();
      return { name: user.name, email: user.email, programmeName: user.programmeName };
    },

    /** Sets the person's own password from their link; the link is spent, and any other session ends. */
    async setPassword(input: SetPasswordInput, ip: string | null): Promise<{ email: string }> {
      // Hashing is slow: do it before the transaction so the token row is locked only briefly.
      const hashed = hashPassword(input.password);
      return ds.transaction(async (m) => {
        const t = open(await repos.accountTokens.findByHashForUpdate(hashSetupToken(input.token), m));
        const user = t ? await repos.users.findSessionUser(t.userId) : null;
        if (!t || !user || user.disabled) throw new SetupLinkInvalidError();
        const problems = passwordProblems(input.password, user);
        if (problems.length) throw new ValidationError({ password: problems });
        const at = now();
        await repos.users.setPasswordHash(user.id, await hashed, at, m);
        await repos.accountTokens.markUsed(t.id, at, m);
        await repos.accountTokens.revokeOpen(user.id, at, m);
        await repos.users.endSessions(user.id, m);
        await repos.audit.append({ programmeId: user.programmeId, actorId: user.id, action: 'user.password_set', entityType: 'user', entityId: user.id, ip }, m);
        return { email: user.email };
      });
    },

    /** The signed-in person's own change: the current password is required; other sessions end, this one stays. */
    async changePassword(actor: Actor & { email: string }, sessionId: string, input: ChangePasswordInput): Promise<void> {
      const user = await repos.users.findSessionUser(actor.id);
      if (!user) throw new SetupLinkInvalidError();
      const ip = actor.ip ?? 'unknown';
      // A wrong current password counts like a failed sign-in, so a left-open session cannot be used to guess it.
      await limiter.beforeAttempt(user.email, ip);
      if (!user.passwordHash || !(await verifyPassword(user.passwordHash, input.currentPassword))) {
        await limiter.failed(user.email, ip);
        await repos.audit.append({ programmeId: user.programmeId, actorId: user.id, action: 'user.password_change_failed', entityType: 'user', entityId: user.id, ip: actor.ip });
        throw new ValidationError({ currentPassword: ['That is not your current password'] });
      }
      const problems = passwordProblems(input.newPassword, user);
      if (input.newPassword === input.currentPassword) problems.push('Choose a password different from your current one.');
      if (problems.length) throw new ValidationError({ newPassword: problems });
      const hashed = await hashPassword(input.newPassword);
      await ds.transaction(async (m) => {
        await repos.users.setPasswordHash(user.id, hashed, now(), m);
        await repos.accountTokens.revokeOpen(user.id, now(), m);
        await repos.users.endOtherSessions(user.id, sessionId, m);
        await repos.audit.append({ programmeId: user.programmeId, actorId: user.id, action: 'user.password_changed', entityType: 'user', entityId: user.id, ip: actor.ip }, m);
      });
    },
  };
}
export type AccountsService = ReturnType<typeof createAccountsService>;
