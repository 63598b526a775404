import type { EntityManager } from 'typeorm';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { AppRepos } from '../../deps';
import { conversionInputFor } from './conversion-input';

type Reason = 'enrolment' | 'weight' | 'home_location' | 'home_source' | 'manual';

/**
 * Opens a new proposal for a baby inside the caller's transaction: withdraws any still pending, snapshots the
 * input, and marks the baby. The caller enqueues the computation after commit.
 */
export async function openProposal(repos: AppRepos, infant: InfantEntity, reason: Reason, actorId: string | null, m: EntityManager) {
  const site = await repos.sites.findInProgramme(infant.siteId, infant.programmeId, m);
  if (!site) throw new Error('infant site missing');
  const policy = await repos.policies.current(infant.programmeId, m);
  await repos.prescriptions.withdrawPending(infant.id, m);
  const version = await repos.prescriptions.nextVersion(infant.id, m);
  const input = conversionInputFor(infant, site.elevationM, policy.settings);
  const rx = await repos.prescriptions.insert(
    {
      infantId: infant.id, programmeId: infant.programmeId, version, status: 'preparing', reason,
      input: { ...input, policyVersion: policy.version } as unknown as Record<string, unknown>,
      source: infant.homeSource, sourceO2Percent: infant.homeO2Percent, createdBy: actorId,
    },
    m,
  );
  const hasActive = !!(await repos.prescriptions.active(infant.id, m));
  if (hasActive) {
    infant.flags = [...new Set([...infant.flags, 'new_setting_waiting' as const])];
  } else {
    infant.status = 'preparing';
  }
  await repos.audit.append(
    { programmeId: infant.programmeId, actorId, action: 'prescription.requested', entityType: 'infant', entityId: infant.id, details: { prescriptionId: rx.id, version, reason } },
    m,
  );
  return rx;
}
