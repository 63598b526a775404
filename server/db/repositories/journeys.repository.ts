import type { DataSource, EntityManager } from 'typeorm';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { JourneyEntity } from '../entities/journey.entity';

// Journeys carry programme_id and infant_id; nurse rules need the baby's nurse, so reads join infants.
export const JOURNEY_ACL_COLUMNS = { programmeId: 'j.programme_id', infantId: 'j.infant_id', nurseId: 'i.nurse_id' };

export interface JourneyWithInfant {
  journey: JourneyEntity;
  infantName: string;
}

export function createJourneysRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(JourneyEntity);
  const visible = (acl: SqlFilter, m?: EntityManager) =>
    repo(m).createQueryBuilder('j').innerJoin('infants', 'i', 'i.id = j.infant_id')
      .addSelect("i.given_name || ' ' || i.family_name", 'infant_name').where(acl.sql, acl.params);
  const withNames = async (qb: ReturnType<typeof visible>): Promise<JourneyWithInfant[]> => {
    const { entities, raw } = await qb.getRawAndEntities<{ j_id: string; infant_name: string }>();
    const names = new Map(raw.map((r) => [r.j_id, r.infant_name]));
    return entities.map((journey) => ({ journey, infantName: names.get(journey.id) ?? '' }));
  };
  return {
    insert: (data: Partial<JourneyEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (j: JourneyEntity, m: EntityManager) => repo(m).save(j),
    findForUpdate: (id: string, m: EntityManager) => repo(m).createQueryBuilder('j').setLock('pessimistic_write').where('j.id = :id', { id }).getOne(),
    findVisible: async (id: string, acl: SqlFilter) => (await withNames(visible(acl).andWhere('j.id = :id', { id })))[0] ?? null,
    /** A baby's journey checks, newest first. */
    listForInfant: (infantId: string, acl: SqlFilter) =>
      withNames(visible(acl).andWhere('j.infant_id = :infantId', { infantId }).orderBy('j.created_at', 'DESC').addOrderBy('j.id', 'DESC').limit(200)),
    /** Checks awaiting a consultant, oldest first. */
    waiting: (acl: SqlFilter) =>
      withNames(visible(acl).andWhere("j.status = 'waiting'").orderBy('j.created_at', 'ASC').addOrderBy('j.id', 'ASC').limit(500)),
    /**
     * Approved journeys leaving on a calendar date (YYYY-MM-DD), across programmes, for the reminder the day
     * before departure. Plain rows: the caller decides who is told and how.
     */
    approvedDepartingOn: (departOn: string, m?: EntityManager) =>
      repo(m).createQueryBuilder('j').where("j.status = 'approved'").andWhere('j.depart_on = :departOn', { departOn })
        .orderBy('j.programme_id').addOrderBy('j.id').getMany(),
    /** The next (or current) approved journey of a baby, one whose return date has not passed: for the printed care plan. */
    currentApproved: (infantId: string, today: string) =>
      repo().createQueryBuilder('j').where("j.status = 'approved'").andWhere('j.infant_id = :infantId', { infantId })
        .andWhere('j.return_on >= :today', { today }).orderBy('j.depart_on', 'ASC').addOrderBy('j.created_at', 'DESC').getOne(),
  };
}
export type JourneysRepository = ReturnType<typeof createJourneysRepository>;
