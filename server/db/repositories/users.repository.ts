import { In, type DataSource, type EntityManager } from 'typeorm';
import { USER_SORTS, type ListUsersQuery } from '@shared/schemas/users';
import type { Role } from '@shared/auth/roles';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { UserEntity } from '../entities/user.entity';
import { containsPattern, cutPage, keysetPageSql, pageAndCount, reversed, type KeyPart, type KeysetPosition } from './list-paging';
import { createRowEstimates } from './row-estimates';
import { DEFAULT_COUNTRY } from '@shared/phone/phone';

// People's sorts, each ending in the id so no two rows tie (list-paging.ts); by role, people of one role by name.
// Each is read from an index of migration MessageAndPeopleListIndexes, alone or after a role filter.
const part = (expr: string, cast: string, text: string): KeyPart => ({ expr, dir: 'ASC', cast, text, out: text });
const ID = part('u.id', 'uuid', 'id');
const NAME = part('u.name', 'text', 'name');
const ASCENDING: Record<string, KeyPart[]> = {
  name: [NAME, ID],
  email: [part('u.email', 'text', 'email'), ID],
  role: [part('u.role', 'text', 'role'), NAME, ID],
  createdAt: [part('u.created_at', 'timestamptz', 'k_created_at'), ID],
};
export const USER_SORT_KEYS = Object.fromEntries(
  USER_SORTS.map((sort) => [sort, sort.startsWith('-') ? reversed(ASCENDING[sort.slice(1)]!) : ASCENDING[sort]!]),
) as Record<ListUsersQuery['sort'], KeyPart[]>;

/** One person as the People list reads them (whether a password is set, never the hash). */
export interface UserListRow {
  id: string; email: string; name: string; role: Role; programme_id: string; disabled: boolean; password_set: boolean;
  created_at: Date; last_sign_in_at: Date | null; k_created_at: string;
}
export const USER_ACL_COLUMNS = { programmeId: 'u.programme_id', id: 'u.id' };

export interface UserWithProgramme extends UserEntity {
  programmeName: string;
  programmeTimeZone: string;
  programmeCountry: string;
}

export function createUsersRepository(ds: DataSource) {
  const estimateRows = createRowEstimates(ds);
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(UserEntity);
  return {
    findByEmail: (email: string) => repo().findOne({ where: { email } }),
    findInProgramme: (ids: string[], programmeId: string) => repo().find({ where: { id: In(ids), programmeId } }),

    /** The signed-in user with programme name, in one statement (runs on every authenticated request). */
    async findSessionUser(id: string): Promise<UserWithProgramme | null> {
      const row = await repo()
        .createQueryBuilder('u')
        .innerJoin('programmes', 'p', 'p.id = u.programme_id')
        .addSelect('p.name', 'programme_name')
        .addSelect('p.time_zone', 'programme_time_zone')
        .addSelect(`(SELECT pp.settings->>'country' FROM programme_policies pp WHERE pp.programme_id = p.id ORDER BY pp.version DESC LIMIT 1)`, 'programme_country')
        .where('u.id = :id', { id })
        .getRawAndEntities();
      const user = row.entities[0];
      return user ? Object.assign(user, { programmeName: row.raw[0].programme_name as string, programmeTimeZone: row.raw[0].programme_time_zone as string,
        programmeCountry: (row.raw[0].programme_country as string | null) ?? DEFAULT_COUNTRY }) : null;
    },

    findOneWhere: (id: string, acl: SqlFilter, m?: EntityManager) =>
      repo(m).createQueryBuilder('u').where('u.id = :id', { id }).andWhere(acl.sql, acl.params).getOne(),

    /** One page of People in the sort's order from a position (list-paging.ts, prepared: prepared.ts), and how many match. */
    async list(query: ListUsersQuery, acl: SqlFilter, at: KeysetPosition) {
      const named: Record<string, unknown> = { ...acl.params };
      const where = [`(${acl.sql})`];
      if (query.role) {
        named.role = query.role;
        where.push('u.role = :role');
      }
      if (query.q) {
        named.q = containsPattern(query.q);
        where.push('(u.name ILIKE :q OR u.email ILIKE :q)');
      }
      const page = keysetPageSql({
        select: `SELECT u.id, u.email, u.name, u.role, u.programme_id, u.disabled, u.password_hash IS NOT NULL AS password_set, u.created_at,
          u.last_sign_in_at, u.created_at::text AS k_created_at FROM users u`,
        where, params: named, key: USER_SORT_KEYS[query.sort], at, limit: query.pageSize + 1,
      });
      const { rows, total, estimate } = await pageAndCount<UserListRow>(ds, estimateRows, page, { sql: `SELECT 1 FROM users u WHERE ${where.join(' AND ')}`, params: named }, true);
      return { ...cutPage(rows, query.pageSize, at), total, estimate };
    },

    insert: (data: Partial<UserEntity>, m?: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (user: UserEntity, m?: EntityManager) => repo(m).save(user),
    markSignedIn: (id: string) => repo().update({ id }, { lastSignInAt: new Date() }),
    setPasswordHash: (id: string, passwordHash: string | null, at: Date, m: EntityManager) =>
      repo(m).update({ id }, { passwordHash, passwordChangedAt: passwordHash ? at : null }),

    /** Ends every stored session of a user at once (used when an account is disabled). */
    endSessions: (userId: string, m?: EntityManager) =>
      (m ?? ds.manager).query(`DELETE FROM session WHERE (sess::jsonb -> 'passport') ->> 'user' = $1`, [userId]),

    /** Ends every session of a user but the one given (after they change their own password). */
    endOtherSessions: (userId: string, keepSid: string, m?: EntityManager) =>
      (m ?? ds.manager).query(`DELETE FROM session WHERE (sess::jsonb -> 'passport') ->> 'user' = $1 AND sid <> $2`, [userId, keepSid]),

    /** Removes expired sign-in sessions; returns how many went. */
    async pruneExpiredSessions(): Promise<number> {
      // TypeORM answers a DELETE with [rows, rowCount].
      const result = await ds.query(`DELETE FROM session WHERE expire < now()`);
      return Array.isArray(result) ? Number(result[1] ?? 0) : 0;
    },
  };
}
export type UsersRepository = ReturnType<typeof createUsersRepository>;
