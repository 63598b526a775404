import type { DataSource, EntityManager } from 'typeorm';
import type { UserEntity } from '../../db/entities/user.entity';
import type { AppRepos } from '../../deps';
import { newSetupToken, setupLink } from '../../auth/setup-tokens';
import type { AccountMail } from '../../notifications/account-mail';
import { ServiceUnavailableError } from '../../lib/errors';

export interface InvitationDeps {
  ds: DataSource;
  repos: Pick<AppRepos, 'users' | 'audit' | 'contacts' | 'programmes' | 'accountTokens'>;
  mail: AccountMail;
  publicUrl: string;
  setupLinkHours: number;
  now: () => Date;
}

// One answer whatever happened to the e-mail, so a failure says nothing about whether the address had an account.
export const mailUnavailable = () =>
  new ServiceUnavailableError('The e-mail to that address could not be sent just now. Nothing needs undoing: try again in a moment.');

/** A fresh single-use link for a person, replacing any still open; returns the link to e-mail (never stored). */
export async function issueSetupLink(deps: InvitationDeps, user: UserEntity, createdBy: string | null, m: EntityManager) {
  const now = deps.now();
  const { token, tokenHash } = newSetupToken();
  const expiresAt = new Date(now.getTime() + deps.setupLinkHours * 3600_000);
  await deps.repos.accountTokens.revokeOpen(user.id, now, m);
  await deps.repos.accountTokens.insert({ userId: user.id, tokenHash, createdBy, expiresAt }, m);
  return { link: setupLink(deps.publicUrl, token), expiresAt };
}

export async function sendOrUnavailable(send: () => Promise<void>): Promise<void> {
  try {
    await send();
  } catch {
    throw mailUnavailable();
  }
}
