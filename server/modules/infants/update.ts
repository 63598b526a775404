import { weightWarnings } from '@shared/clinical/weight-check';
import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import { growthDrift } from '@shared/clinical/growth';
import type { AppAbility } from '@shared/auth/ability';
import type { ContactInput, UpdateInfantInput } from '@shared/schemas/infants';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { AppRepos } from '../../deps';
import { ConflictError, NeedsConfirmationError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { openProposal } from '../prescriptions/proposals';
import { homePlace } from './enrol';

type Reason = 'weight' | 'home_location' | 'home_source';

async function lockEditable(repos: AppRepos, ability: AppAbility, id: string, m: EntityManager) {
  const infant = await repos.infants.findForUpdate(id, m);
  const fields = infant ? ({ programmeId: infant.programmeId, nurseId: infant.nurseId, id: infant.id } as Record<string, unknown>) : null;
  if (!infant || !ability.can('read', subject('Infant', fields!))) throw new NotFoundError('No such baby in your records.');
  if (!ability.can('update', subject('Infant', fields!))) throw new NotFoundError('No such baby in your records.');
  return infant;
}

/** Growth drift: does the approved flow now give this heavier baby materially less oxygen than was approved? */
async function refreshDriftFlag(repos: AppRepos, infant: InfantEntity, m: EntityManager) {
  const active = await repos.prescriptions.active(infant.id, m);
  if (!active || active.approvedFlowLpm === null || active.approvedWeightKg === null) return null;
  const policy = await repos.policies.current(infant.programmeId, m);
  const drift = growthDrift({
    flowLpm: active.approvedFlowLpm, sourceO2Percent: active.sourceO2Percent, approvedWeightKg: active.approvedWeightKg,
    newWeightKg: infant.weightKg, flowmeterStepsLpm: policy.settings.flowmeterStepsLpm, driftThresholdFio2: policy.settings.driftThresholdFio2,
  });
  const outgrown = drift.driftFio2 >= policy.settings.driftThresholdFio2 - 1e-12;
  infant.flags = outgrown ? [...new Set([...infant.flags, 'growth_drift' as const])] : infant.flags.filter((f) => f !== 'growth_drift');
  return drift;
}

/**
 * A new weight from any source (record edit or a nurse's reading): re-checks growth drift and opens a new proposal,
 * because the same flow gives a heavier baby less oxygen (STOP-ROP model). Returns the new proposal's id.
 */
export async function applyNewWeight(repos: AppRepos, infant: InfantEntity, weightKg: number, weightDate: string, actorId: string | null, m: EntityManager) {
  if (weightDate < infant.weightDate || Math.abs(weightKg - infant.weightKg) < 1e-9) return null;
  infant.weightKg = weightKg;
  infant.weightDate = weightDate;
  await refreshDriftFlag(repos, infant, m);
  const rx = await openProposal(repos, infant, 'weight', actorId, m);
  infant.rowVersion += 1;
  return rx.id as string;
}

export async function updateInfant(ds: DataSource, repos: AppRepos, ability: AppAbility, actor: Actor, id: string, input: UpdateInfantInput, today: string) {
  const result = await ds.transaction(async (m) => {
    const infant = await lockEditable(repos, ability, id, m);
    if (infant.rowVersion !== input.rowVersion) throw new ConflictError('Someone else changed this record meanwhile. Reload to see their change, then try again.');
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    const reasons: Reason[] = [];
    const set = <K extends keyof InfantEntity>(key: K, value: InfantEntity[K], reason?: Reason) => {
      if (value === undefined || JSON.stringify(infant[key]) === JSON.stringify(value)) return;
      changes[key] = { from: infant[key], to: value };
      infant[key] = value;
      if (reason && !reasons.includes(reason)) reasons.push(reason);
    };
    if (input.weightKg !== undefined && input.weightDate !== undefined) {
      if (input.weightDate > today || input.weightDate < infant.birthDate) throw new ValidationError({ weightDate: ['The weighing date must be between birth and today'] });
      const warnings = weightWarnings(input.weightKg, input.weightDate, { kg: infant.weightKg, date: infant.weightDate });
      if (warnings.length && !input.weightConfirmed) throw new NeedsConfirmationError('Check the weight before saving.', { weightKg: warnings });
      set('weightKg', input.weightKg, 'weight');
      set('weightDate', input.weightDate);
    }
    if (input.home) {
      const policy = await repos.policies.current(infant.programmeId, m);
      set('homeAddress', input.home.address);
      set('homeLocation', input.home.location, 'home_location');
      const place = homePlace(input.home.location, policy.settings);
      infant.homePressureMmHg = place.homePressureMmHg;
      infant.homeElevationM = place.homeElevationM;
      set('homeSource', input.home.source, 'home_source');
      set('homeO2Percent', input.home.o2Percent, 'home_source');
    }
    if (input.nurseId || input.consultantId) {
      const people = await repos.users.findInProgramme([input.nurseId, input.consultantId].filter((x): x is string => !!x), infant.programmeId);
      const ok = (pid: string | undefined, role: string) => !pid || people.some((p) => p.id === pid && p.role === role && !p.disabled);
      if (!ok(input.nurseId, 'nurse')) throw new ValidationError({ nurseId: ['Choose a home-care nurse of your programme'] });
      if (!ok(input.consultantId, 'consultant')) throw new ValidationError({ consultantId: ['Choose a consultant of your programme'] });
      if (input.nurseId) set('nurseId', input.nurseId);
      if (input.consultantId) set('consultantId', input.consultantId);
    }
    const drift = reasons.includes('weight') ? await refreshDriftFlag(repos, infant, m) : null;
    const rx = reasons.length ? await openProposal(repos, infant, reasons[0], actor.id, m) : null;
    if (Object.keys(changes).length) infant.rowVersion += 1;
    await repos.infants.save(infant, m);
    if (Object.keys(changes).length) {
      await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: 'infant.updated', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { changes, growthDrift: drift } }, m);
    }
    return { infant, prescriptionId: rx?.id ?? null };
  });
  return result;
}

export async function replaceContacts(ds: DataSource, repos: AppRepos, ability: AppAbility, actor: Actor, id: string, contacts: ContactInput[]) {
  return ds.transaction(async (m) => {
    const infant = await lockEditable(repos, ability, id, m);
    const before = await repos.contacts.listForInfant(id, m);
    await repos.contacts.replace(id, infant.programmeId, contacts, m);
    await repos.contacts.linkFamilyAccounts(id, infant.programmeId, m);
    // Every number just saved was read (E.164), so an old unreadable one is gone.
    await repos.infants.clearUnreadableNumberFlag(id, m);
    await repos.audit.append({
      programmeId: infant.programmeId, actorId: actor.id, action: 'infant.contacts_changed', entityType: 'infant', entityId: id, ip: actor.ip,
      details: { before: before.map((c) => ({ name: c.name, relation: c.relation, preferredChannel: c.preferredChannel, consentSms: c.consentSms, consentEmail: c.consentEmail })), after: contacts.map((c) => ({ name: c.name, relation: c.relation, preferredChannel: c.preferredChannel, consentSms: c.consentSms, consentEmail: c.consentEmail })) },
    }, m);
    return repos.contacts.listForInfant(id, m);
  });
}
