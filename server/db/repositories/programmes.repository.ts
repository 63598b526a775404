import type { DataSource, EntityManager } from 'typeorm';
import { ProgrammeEntity } from '../entities/programme.entity';

export function createProgrammesRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(ProgrammeEntity);
  return {
    findById: (id: string) => repo().findOne({ where: { id } }),
    findBySlug: (slug: string) => repo().findOne({ where: { slug } }),
    insert: (data: Partial<ProgrammeEntity>, m?: EntityManager) => repo(m).save(repo(m).create(data)),
  };
}
export type ProgrammesRepository = ReturnType<typeof createProgrammesRepository>;
