import type { DataSource, EntityManager } from 'typeorm';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { EQUIPMENT_INSTALLED_KEY, EQUIPMENT_ORDERED_KEY } from '@shared/discharge/order-ticks';
import { DischargeEntity, DischargeItemEntity } from '../entities/discharge.entity';

export interface DischargeListRow {
  infant_id: string; infant_name: string; discharged_on: string | null; done_keys: string[]; setting_approved: boolean;
}

export function createDischargesRepository(ds: DataSource) {
  const items = (m?: EntityManager) => (m ?? ds.manager).getRepository(DischargeItemEntity);
  const steps = (m?: EntityManager) => (m ?? ds.manager).getRepository(DischargeEntity);
  return {
    itemsFor: (infantId: string, m?: EntityManager) => items(m).find({ where: { infantId } }),
    saveItem: (row: Partial<DischargeItemEntity>, m: EntityManager) => items(m).save(items(m).create(row)),
    stepFor: (infantId: string, m?: EntityManager) => steps(m).findOne({ where: { infantId } }),
    /** Locks the baby's discharge row (made first if there is none) for a read-modify-write in the caller's transaction. */
    async lockStep(infantId: string, programmeId: string, m: EntityManager): Promise<DischargeEntity> {
      await m.query('INSERT INTO discharges (infant_id, programme_id) VALUES ($1, $2) ON CONFLICT (infant_id) DO NOTHING', [infantId, programmeId]);
      return steps(m).createQueryBuilder('d').setLock('pessimistic_write').where('d.infant_id = :infantId', { infantId }).getOneOrFail();
    },
    saveStep: (row: DischargeEntity, m: EntityManager) => steps(m).save(row),

    /**
     * Babies the caller may read whose discharge is ahead of them: a date from `today` on, or items ticked and no
     * date yet. With the items done (ticked, or by an equipment order) and whether the setting is approved; the caller works out what is missing.
     */
    upcoming: async (acl: SqlFilter, today: string, limit: number): Promise<DischargeListRow[]> => {
      const sql = `
        SELECT i.id AS infant_id, i.given_name || ' ' || i.family_name AS infant_name, d.discharged_on::text AS discharged_on,
               coalesce((SELECT array_agg(di.key) FROM discharge_items di WHERE di.infant_id = i.id AND di.done), '{}')
               -- The items the baby's equipment orders do (shared/discharge/order-ticks.ts says when).
               || CASE WHEN EXISTS (SELECT 1 FROM equipment_orders o WHERE o.infant_id = i.id AND o.purpose IN ('delivery', 'change')
                                       AND o.status IN ('sent', 'confirmed', 'delivered')) THEN ARRAY[:orderedKey]::text[] ELSE '{}' END
               || CASE WHEN EXISTS (SELECT 1 FROM equipment_orders o JOIN programmes p ON p.id = o.programme_id
                                     WHERE o.infant_id = i.id AND o.purpose IN ('delivery', 'change') AND o.status = 'delivered'
                                       AND (d.discharged_on IS NULL OR (o.delivered_at AT TIME ZONE p.time_zone)::date <= d.discharged_on))
                       THEN ARRAY[:installedKey]::text[] ELSE '{}' END AS done_keys,
               EXISTS (SELECT 1 FROM prescriptions rx WHERE rx.infant_id = i.id AND rx.status = 'active' AND rx.approved_flow_lpm IS NOT NULL) AS setting_approved
          FROM infants i LEFT JOIN discharges d ON d.infant_id = i.id
         WHERE ${acl.sql}
           AND (d.discharged_on >= :today
                OR (d.discharged_on IS NULL AND EXISTS (SELECT 1 FROM discharge_items di WHERE di.infant_id = i.id AND di.done)))
         ORDER BY d.discharged_on NULLS LAST, i.family_name, i.given_name, i.id
         LIMIT :limit`;
      const [text, params] = ds.driver.escapeQueryWithParameters(sql, { ...acl.params, today, limit, orderedKey: EQUIPMENT_ORDERED_KEY, installedKey: EQUIPMENT_INSTALLED_KEY });
      return ds.query(text, params);
    },
  };
}
export type DischargesRepository = ReturnType<typeof createDischargesRepository>;
