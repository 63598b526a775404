import type { CreateUserInput, ListUsersQuery, User, UsersPage } from '@shared/schemas/users';
import type { InvitationResponse } from '@shared/schemas/accounts';
import type { AppAbility } from '@shared/auth/ability';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { keyValues } from '../../db/repositories/list-paging';
import { USER_ACL_COLUMNS, USER_SORT_KEYS, type UserListRow } from '../../db/repositories/users.repository';
import { encodeCursor, pageCursors, positionOf, readingFrom } from '../../lib/cursor';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { listRowToUserDto, toUserDto } from './users.mapper';
import { issueSetupLink, sendOrUnavailable, type InvitationDeps } from './invitations';

export function createUsersService(deps: InvitationDeps) {
  const { ds, repos, mail } = deps;
  const { users, audit, contacts } = repos;

  async function setDisabled(ability: AppAbility, actor: Actor, id: string, disabled: boolean): Promise<User> {
    if (disabled && id === actor.id) throw new ConflictError('You cannot disable your own account.');
    return ds.transaction(async (m) => {
      const user = await users.findOneWhere(id, accessibleWhere(ability, 'disable', 'User', USER_ACL_COLUMNS), m);
      if (!user) throw new NotFoundError('No such person in your programme.');
      if (user.disabled === disabled) return toUserDto(user);
      user.disabled = disabled;
      user.disabledAt = disabled ? new Date() : null;
      await users.save(user, m);
      if (disabled) await users.endSessions(user.id, m);
      await audit.append(
        { programmeId: user.programmeId, actorId: actor.id, action: disabled ? 'user.disabled' : 'user.enabled', entityType: 'user', entityId: user.id, ip: actor.ip },
        m,
      );
      return toUserDto(user);
    });
  }

  const names = async (actor: Actor) => {
    const [me, programme] = await Promise.all([users.findSessionUser(actor.id), repos.programmes.findById(actor.programmeId)]);
    return { invitedBy: me?.name ?? 'Your programme admin', programmeName: programme?.name ?? 'your programme' };
  };

  return {
    async list(ability: AppAbility, query: ListUsersQuery): Promise<UsersPage> {
      const key = USER_SORT_KEYS[query.sort];
      const { from, at } = positionOf(query, query.sort, key.length - 1);
      const { rows, more, total, estimate } = await readingFrom(from, users.list(query, accessibleWhere(ability, 'read', 'User', USER_ACL_COLUMNS), at));
      const cursorOf = (r: UserListRow) => encodeCursor({ sort: query.sort, values: keyValues(key, r as unknown as Record<string, unknown>).slice(0, -1), id: r.id });
      return { items: rows.map(listRowToUserDto), total, totalIsEstimate: estimate, ...pageCursors({ query, from, rows, more, cursorOf }) };
    },

    /**
     * Adds a person without a password and e-mails them a set-up link. An address that already has an account
     * (here or in another programme) gets the same answer; its owner is told someone tried, and nothing changes.
     * Adding a person again while their link is still unused sends them a fresh link.
     */
    async invite(actor: Actor, input: CreateUserInput): Promise<InvitationResponse> {
      const { invitedBy, programmeName } = await names(actor);
      const existing = await users.findByEmail(input.email);
      const answer: InvitationResponse = { status: 'invitation_sent', email: input.email };
      if (existing && !(existing.programmeId === actor.programmeId && existing.passwordHash === null && !existing.disabled)) {
        const theirs = existing.programmeId === actor.programmeId ? programmeName : (await repos.programmes.findById(existing.programmeId))?.name ?? 'another programme';
        await audit.append({ programmeId: actor.programmeId, actorId: actor.id, action: 'user.invite_existing_address', entityType: 'user', entityId: null, ip: actor.ip, details: { role: input.role } });
        await sendOrUnavailable(() => mail.alreadyHasAccount({ to: existing.email, name: existing.name, programmeName: theirs }));
        return answer;
      }
      const sent = await ds.transaction(async (m) => {
        const user = existing ?? (await users.insert({ ...input, programmeId: actor.programmeId, passwordHash: null }, m));
        if (!existing && user.role === 'family') await contacts.linkContactsToAccount(user.id, user.email, actor.programmeId, m);
        const link = await issueSetupLink(deps, user, actor.id, m);
        await audit.append(
          { programmeId: actor.programmeId, actorId: actor.id, action: existing ? 'user.invitation_resent' : 'user.invited', entityType: 'user', entityId: user.id, details: { role: user.role }, ip: actor.ip },
          m,
        );
        return { user, ...link };
      }).catch((e: { code?: string }) => {
        // Two admins adding the same new address at once: the unique index decides, and the answer is the same.
        if (e.code === '23505') return null;
        throw e;
      });
      if (sent) await sendOrUnavailable(() => mail.invitation({ to: sent.user.email, name: sent.user.name, programmeName, invitedBy, link: sent.link, expiresAt: sent.expiresAt }));
      return answer;
    },

    /** The admin's "send a new set-up link": the old password stops working and every session ends. */
    async sendSetupLink(ability: AppAbility, actor: Actor, id: string): Promise<User> {
      if (id === actor.id) throw new ConflictError('To change your own password use "Change my password".');
      const { programmeName } = await names(actor);
      const sent = await ds.transaction(async (m) => {
        const user = await users.findOneWhere(id, accessibleWhere(ability, 'update', 'User', USER_ACL_COLUMNS), m);
        if (!user) throw new NotFoundError('No such person in your programme.');
        if (user.disabled) throw new ConflictError('This account is disabled. Enable it first.');
        await users.setPasswordHash(user.id, null, deps.now(), m);
        user.passwordHash = null;
        await users.endSessions(user.id, m);
        const link = await issueSetupLink(deps, user, actor.id, m);
        await audit.append({ programmeId: user.programmeId, actorId: actor.id, action: 'user.setup_link_sent', entityType: 'user', entityId: user.id, ip: actor.ip }, m);
        return { user, ...link };
      });
      await sendOrUnavailable(() => mail.newSetupLink({ to: sent.user.email, name: sent.user.name, programmeName, link: sent.link, expiresAt: sent.expiresAt }));
      return toUserDto(sent.user);
    },

    disable: (ability: AppAbility, actor: Actor, id: string) => setDisabled(ability, actor, id, true),
    enable: (ability: AppAbility, actor: Actor, id: string) => setDisabled(ability, actor, id, false),
  };
}
export type UsersService = ReturnType<typeof createUsersService>;
