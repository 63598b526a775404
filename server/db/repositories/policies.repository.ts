import type { DataSource, EntityManager } from 'typeorm';
import { DEFAULT_POLICY_SETTINGS, withPolicyDefaults, type Policy, type PolicySettings } from '@shared/schemas/policy';
import { ProgrammePolicyEntity } from '../entities/programme-policy.entity';

export function createPoliciesRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(ProgrammePolicyEntity);
  return {
    /** The newest version; a programme that never saved one runs on the defaults (version 0). */
    async current(programmeId: string, m?: EntityManager): Promise<Policy> {
      const row = await repo(m).findOne({ where: { programmeId }, order: { version: 'DESC' } });
      return row
        ? { programmeId, version: row.version, settings: withPolicyDefaults(row.settings), createdAt: row.createdAt.toISOString() }
        : { programmeId, version: 0, settings: DEFAULT_POLICY_SETTINGS, createdAt: null };
    },
    history: (programmeId: string) => repo().find({ where: { programmeId }, order: { version: 'DESC' }, take: 50 }),
    insertVersion: (programmeId: string, version: number, settings: PolicySettings, createdBy: string | null, m?: EntityManager) =>
      repo(m).save(repo(m).create({ programmeId, version, settings, createdBy })),
  };
}
export type PoliciesRepository = ReturnType<typeof createPoliciesRepository>;
