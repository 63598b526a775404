import type { DataSource } from 'typeorm';
import type { CreateUserInput, CreateUserResponse, ListUsersQuery, User, UsersPage } from '../../../shared/schemas/users';
import type { AppAbility } from '../../../shared/auth/ability';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { generateInitialPassword, hashPassword } from '../../auth/passwords';
import { USER_ACL_COLUMNS, type UsersRepository } from '../../db/repositories/users.repository';
import type { AuditRepository } from '../../db/repositories/audit.repository';
import type { ContactsRepository } from '../../db/repositories/contacts.repository';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { toUserDto } from './users.mapper';

interface Deps {
  ds: DataSource;
  users: UsersRepository;
  audit: AuditRepository;
  contacts: ContactsRepository;
}

export function createUsersService({ ds, users, audit, contacts }: Deps) {
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

  return {
    async list(ability: AppAbility, query: ListUsersQuery): Promise<UsersPage> {
      const [rows, total] = await users.list(query, accessibleWhere(ability, 'read', 'User', USER_ACL_COLUMNS));
      return { items: rows.map(toUserDto), total };
    },

    async create(actor: Actor, input: CreateUserInput): Promise<CreateUserResponse> {
      if (await users.findByEmail(input.email)) {
        throw new ConflictError('That e-mail address already has an account.', { email: ['That e-mail address already has an account.'] });
      }
      const initialPassword = generateInitialPassword();
      const passwordHash = await hashPassword(initialPassword);
      const user = await ds.transaction(async (m) => {
        const created = await users.insert({ ...input, programmeId: actor.programmeId, passwordHash }, m);
        if (created.role === 'family') await contacts.linkContactsToAccount(created.id, created.email, actor.programmeId, m);
        await audit.append(
          { programmeId: actor.programmeId, actorId: actor.id, action: 'user.created', entityType: 'user', entityId: created.id, details: { role: input.role }, ip: actor.ip },
          m,
        );
        return created;
      }).catch((e: { code?: string }) => {
        // Two admins adding the same e-mail at once: the unique index decides.
        if (e.code === '23505') throw new ConflictError('That e-mail address already has an account.', { email: ['That e-mail address already has an account.'] });
        throw e;
      });
      return { user: toUserDto(user), initialPassword };
    },

    disable: (ability: AppAbility, actor: Actor, id: string) => setDisabled(ability, actor, id, true),
    enable: (ability: AppAbility, actor: Actor, id: string) => setDisabled(ability, actor, id, false),
  };
}
export type UsersService = ReturnType<typeof createUsersService>;
