import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import { AccountSetupTokenEntity } from '../entities/account-setup-token.entity';

export function createAccountTokensRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(AccountSetupTokenEntity);
  return {
    insert: (data: Partial<AccountSetupTokenEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    /** Locks the row, so two uses of one link at once cannot both succeed. */
    findByHashForUpdate: (tokenHash: string, m: EntityManager) =>
      repo(m).createQueryBuilder('t').setLock('pessimistic_write').where('t.token_hash = :tokenHash', { tokenHash }).getOne(),
    findByHash: (tokenHash: string) => repo().findOne({ where: { tokenHash } }),
    markUsed: (id: string, at: Date, m: EntityManager) => repo(m).update({ id }, { usedAt: at }),
    /** Every still-open link of a person stops working (a newer link was sent, or the password was set). */
    revokeOpen: (userId: string, at: Date, m: EntityManager) => repo(m).update({ userId, usedAt: IsNull(), revokedAt: IsNull() }, { revokedAt: at }),
  };
}
export type AccountTokensRepository = ReturnType<typeof createAccountTokensRepository>;
