import type { DataSource } from 'typeorm';
import type { UpdatePolicyInput } from '@shared/schemas/policy';
import type { AppRepos } from '../../deps';
import type { JobProducer } from '../../jobs/producer';
import { ConflictError } from '../../lib/errors';
import type { Actor } from '../../lib/http';

function changedKeys(before: Record<string, unknown>, after: Record<string, unknown>, prefix = ''): string[] {
  return Object.keys(after).flatMap((k) => {
    const a = before?.[k];
    const b = after[k];
    if (b && typeof b === 'object' && !Array.isArray(b)) return changedKeys(a as Record<string, unknown>, b as Record<string, unknown>, `${prefix}${k}.`);
    return JSON.stringify(a) === JSON.stringify(b) ? [] : [`${prefix}${k}`];
  });
}

export function createPolicyService(ds: DataSource, repos: AppRepos, jobs: JobProducer) {
  return {
    current: (programmeId: string) => repos.policies.current(programmeId),

    async history(programmeId: string) {
      const rows = await repos.policies.history(programmeId);
      const names = await repos.infants.peopleNames(rows.map((r) => r.createdBy));
      return { items: rows.map((r) => ({ version: r.version, createdAt: r.createdAt.toISOString(), createdBy: r.createdBy ? { id: r.createdBy, name: names.get(r.createdBy) ?? '' } : null })) };
    },

    /** Saves a new version; the previous ones stay for the record. Schedules are re-planned by the worker. */
    async update(actor: Actor, input: UpdatePolicyInput) {
      const saved = await ds
        .transaction(async (m) => {
          const current = await repos.policies.current(actor.programmeId, m);
          if (current.version !== input.baseVersion) {
            throw new ConflictError(`The settings were changed meanwhile (now version ${current.version}). Reload and make your change again.`);
          }
          const version = current.version + 1;
          await repos.policies.insertVersion(actor.programmeId, version, input.settings, actor.id, m);
          await repos.audit.append(
            { programmeId: actor.programmeId, actorId: actor.id, action: 'policy.changed', entityType: 'policy', entityId: actor.programmeId, ip: actor.ip, details: { version, changed: changedKeys(current.settings, input.settings) } },
            m,
          );
          return version;
        })
        .catch((e: { code?: string }) => {
          if (e.code === '23505') throw new ConflictError('Another admin saved the settings at the same moment. Reload and try again.');
          throw e;
        });
      await jobs.enqueueReplanProgramme(actor.programmeId, saved);
      return repos.policies.current(actor.programmeId);
    },
  };
}
export type PolicyService = ReturnType<typeof createPolicyService>;
