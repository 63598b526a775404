import type { DataSource, EntityManager } from 'typeorm';
import { EquipmentOrderEntity } from '../entities/equipment-order.entity';
import type { SqlFilter } from '../../auth/casl-to-sql';
import type { OrderStatus } from '@shared/schemas/equipment-orders';

/** ACL fields of an order: the programme on the order, the nurse on the baby. */
export const ORDER_ACL_COLUMNS = { programmeId: 'o.programme_id', nurseId: 'i.nurse_id', id: 'o.id' };

export type OrderWithName = EquipmentOrderEntity & { infantName: string };

export interface OrderListFilter {
  statuses?: readonly OrderStatus[];
  /** Unconfirmed orders whose needed date is on or before this day. */
  neededOnOrBefore?: string;
  after?: { createdAt: string; id: string };
  limit: number;
}

export function createEquipmentOrdersRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(EquipmentOrderEntity);
  const named = (m?: EntityManager) => repo(m).createQueryBuilder('o').innerJoin('infants', 'i', 'i.id = o.infant_id')
    .addSelect("i.family_name || ', ' || i.given_name AS infant_name");
  const withNames = ({ entities, raw }: { entities: EquipmentOrderEntity[]; raw: Array<{ infant_name: string }> }): OrderWithName[] =>
    entities.map((e, n) => Object.assign(e, { infantName: raw[n].infant_name }));
  return {
    /** The next number of the programme's orders; the advisory lock makes two orders at once wait for each other. */
    async nextSeq(programmeId: string, m: EntityManager): Promise<number> {
      await m.query('SELECT pg_advisory_xact_lock(hashtextextended($1, 16))', [`equipment-order-seq:${programmeId}`]);
      const [row] = await m.query('SELECT coalesce(max(seq), 0) + 1 AS next FROM equipment_orders WHERE programme_id = $1', [programmeId]);
      return Number(row.next);
    },
    insert: (data: Partial<EquipmentOrderEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (o: EquipmentOrderEntity, m?: EntityManager) => repo(m).save(o),
    findById: (id: string, m?: EntityManager) => repo(m).findOne({ where: { id } }),
    findForUpdate: (id: string, m: EntityManager) => repo(m).createQueryBuilder('o').setLock('pessimistic_write').where('o.id = :id', { id }).getOne(),
    forInfant: (infantId: string, m?: EntityManager) => repo(m).createQueryBuilder('o').where('o.infant_id = :infantId', { infantId })
      .orderBy('o.created_at', 'DESC').addOrderBy('o.id', 'DESC').limit(200).getMany(),
    /** The programme's orders the caller may read, newest first, one page after a cursor. */
    list: (acl: SqlFilter, f: OrderListFilter): Promise<OrderWithName[]> => {
      const qb = named().where(acl.sql, acl.params);
      if (f.statuses) qb.andWhere('o.status IN (:...statuses)', { statuses: f.statuses });
      if (f.neededOnOrBefore) qb.andWhere('o.needed_by <= :day', { day: f.neededOnOrBefore });
      if (f.after) qb.andWhere('(o.created_at, o.id) < (:afterAt::timestamptz, :afterId::uuid)', { afterAt: f.after.createdAt, afterId: f.after.id });
      return qb.orderBy('o.created_at', 'DESC').addOrderBy('o.id', 'DESC').limit(f.limit).getRawAndEntities().then(withNames);
    },
    /** Counts for the overview: orders whose e-mail failed, and unconfirmed ones due by a day. */
    async flagCounts(acl: SqlFilter, today: string): Promise<{ failed: number; unconfirmed: number }> {
      const row = await repo().createQueryBuilder('o').innerJoin('infants', 'i', 'i.id = o.infant_id')
        .select("count(*) FILTER (WHERE o.status = 'failed')", 'failed')
        .addSelect("count(*) FILTER (WHERE o.status IN ('drafted','sent','failed') AND o.needed_by <= :today)", 'unconfirmed')
        .where(acl.sql, acl.params).setParameter('today', today).getRawOne<{ failed: string; unconfirmed: string }>();
      return { failed: Number(row?.failed ?? 0), unconfirmed: Number(row?.unconfirmed ?? 0) };
    },
  };
}
export type EquipmentOrdersRepository = ReturnType<typeof createEquipmentOrdersRepository>;
