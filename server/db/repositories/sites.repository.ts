import type { DataSource, EntityManager } from 'typeorm';
import { SiteEntity } from '../entities/site.entity';

export function createSitesRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(SiteEntity);
  return {
    listForProgramme: (programmeId: string) => repo().find({ where: { programmeId }, order: { name: 'ASC' } }),
    findInProgramme: (id: string, programmeId: string, m?: EntityManager) => repo(m).findOne({ where: { id, programmeId } }),
    findByName: (programmeId: string, name: string) => repo().findOne({ where: { programmeId, name } }),
    insert: (data: Partial<SiteEntity>) => repo().save(repo().create(data)),
  };
}
export type SitesRepository = ReturnType<typeof createSitesRepository>;
