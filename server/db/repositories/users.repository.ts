import { In, type DataSource, type EntityManager } from 'typeorm';
import type { ListUsersQuery } from '@shared/schemas/users';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { UserEntity } from '../entities/user.entity';
import { DEFAULT_COUNTRY } from '@shared/phone/phone';

const SORT_COLUMNS: Record<string, string> = { name: 'u.name', email: 'u.email', role: 'u.role', createdAt: 'u.created_at' };
export const USER_ACL_COLUMNS = { programmeId: 'u.programme_id', id: 'u.id' };

export interface UserWithProgramme extends UserEntity {
  programmeName: string;
  programmeTimeZone: string;
  programmeCountry: string;
}

export function createUsersRepository(ds: DataSource) {
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

    async list(query: ListUsersQuery, acl: SqlFilter): Promise<[UserEntity[], number]> {
      const desc = query.sort.startsWith('-');
      const qb = repo()
        .createQueryBuilder('u')
        .where(acl.sql, acl.params)
        .orderBy(SORT_COLUMNS[query.sort.replace('-', '')], desc ? 'DESC' : 'ASC')
        .addOrderBy('u.id', 'ASC')
        .skip((query.page - 1) * query.pageSize)
        .take(query.pageSize);
      if (query.role) qb.andWhere('u.role = :role', { role: query.role });
      if (query.q) qb.andWhere('(u.name ILIKE :q OR u.email ILIKE :q)', { q: `%${query.q.replace(/[%_\\]/g, '\\$&')}%` });
      return qb.getManyAndCount();
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
