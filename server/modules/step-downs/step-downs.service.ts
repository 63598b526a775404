import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import { nextStepDown, meetsOvernightTarget, type StudyResult } from '@shared/schedule/step-down';
import type { AppAbility } from '@shared/auth/ability';
import type { PrescriptionReason } from '@shared/schemas/prescriptions';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { createReminderPlanner } from '../reminders/reminders.planner';
import { ConflictError, ForbiddenError, NotFoundError, PolicyNotMetError } from '../../lib/errors';
import { unmetRules } from '@shared/schedule/step-down-rules';
import type { StepDownEvidence, StepDownPreview, StepDownRequestInput } from '@shared/schemas/step-downs';
import { gatherStepDownEvidence } from './evidence';
import type { Actor } from '../../lib/http';

interface StepProposal {
  reason: Extract<PrescriptionReason, 'step_down' | 'step_up' | 'leave_programme'>;
  flowLpm: number;
  periods: PrescriptionEntity['periods'];
  evidence: Record<string, unknown>;
}

/** A step change is a proposal like any other: it waits in the consultant's queue until approved or declined. */
export async function openStepProposal(repos: AppRepos, infant: InfantEntity, active: PrescriptionEntity | null, p: StepProposal, actorId: string | null, m: EntityManager) {
  await repos.prescriptions.withdrawPending(infant.id, m);
  const version = await repos.prescriptions.nextVersion(infant.id, m);
  const rx = await repos.prescriptions.insert(
    {
      infantId: infant.id, programmeId: infant.programmeId, version, status: 'proposed', reason: p.reason, proposedFlowLpm: p.flowLpm,
      periods: p.periods, evidence: p.evidence, computedAt: new Date(),
      input: { from: active ? { flowLpm: active.approvedFlowLpm, periods: active.periods, version: active.version } : null, weightKg: infant.weightKg },
      source: active?.source ?? infant.homeSource, sourceO2Percent: active?.sourceO2Percent ?? infant.homeO2Percent, createdBy: actorId,
    },
    m,
  );
  infant.flags = [...new Set([...infant.flags, 'new_setting_waiting' as const])];
  await repos.infants.save(infant, m);
  await createReminderPlanner(repos).proposalWaiting(infant.programmeId, new Date(), (await repos.policies.current(infant.programmeId, m)).settings, m);
  await repos.audit.append({ programmeId: infant.programmeId, actorId, action: `prescription.${p.reason}_proposed`, entityType: 'infant', entityId: infant.id, details: { prescriptionId: rx.id, version, flowLpm: p.flowLpm, periods: p.periods } }, m);
  return rx;
}

export function createStepDownsService(ds: DataSource, repos: AppRepos) {
  async function visibleForStepDown(ability: AppAbility, infantId: string, m: EntityManager) {
    const visible = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), m);
    if (!visible) throw new NotFoundError('No such baby in your records.');
    if (!ability.can('create', subject('StepDown', { programmeId: visible.programmeId, nurseId: visible.nurseId } as Record<string, unknown>))) throw new ForbiddenError();
    return visible;
  }

  /** Why no step down can be asked for at all (nothing to step down from, or a proposal already waiting). */
  async function blocked(infantId: string, active: PrescriptionEntity | null, m: EntityManager): Promise<string | null> {
    if (!active || (active.approvedFlowLpm ?? 0) <= 0) return 'This baby has no oxygen to step down from.';
    return (await repos.prescriptions.hasPending(infantId, m)) ? 'A new setting is already waiting for sign-off for this baby.' : null;
  }

  return {
    /** What the nurse's form shows before sending: the step that would be proposed and every rule, met or not. */
    async preview(ability: AppAbility, infantId: string, now: Date): Promise<StepDownPreview> {
      return ds.transaction(async (m) => {
        const infant = await visibleForStepDown(ability, infantId, m);
        const active = await repos.prescriptions.active(infantId, m);
        const policy = (await repos.policies.current(infant.programmeId, m)).settings;
        const { checks } = await gatherStepDownEvidence(repos, infant, active, policy, now, m);
        const blockedReason = await blocked(infantId, active, m);
        const next = active && (active.approvedFlowLpm ?? 0) > 0 ? nextStepDown({ flowLpm: active.approvedFlowLpm!, periods: active.periods }, policy) : null;
        return { next: next && { kind: next.kind, label: next.label, flowLpm: next.setting.flowLpm }, checks, blockedReason };
      });
    },

    /**
     * A nurse or coordinator asks for the next step down with a reason; the consultant decides. Every programme
     * rule is checked here: with any unmet, the request is refused (422) unless an override reason is given, in
     * which case the unmet rules and the reason are stored with the proposal and audited.
     */
    async request(ability: AppAbility, actor: Actor, infantId: string, input: StepDownRequestInput, now: Date) {
      return ds.transaction(async (m) => {
        const visible = await visibleForStepDown(ability, infantId, m);
        const infant = (await repos.infants.findForUpdate(visible.id, m))!;
        const active = await repos.prescriptions.active(infantId, m);
        const blockedReason = await blocked(infantId, active, m);
        if (blockedReason) throw new ConflictError(blockedReason);
        const policy = (await repos.policies.current(infant.programmeId, m)).settings;
        const { checks, evidence } = await gatherStepDownEvidence(repos, infant, active, policy, now, m);
        const unmet = unmetRules(checks);
        if (unmet.length && !input.overrideReason) {
          throw new PolicyNotMetError(
            `${unmet.length} of the programme's step-down rules ${unmet.length === 1 ? 'is' : 'are'} not met. Give a reason to ask anyway, or wait until they are.`,
            unmet.map(({ code, message }) => ({ code, message })),
          );
        }
        const next = nextStepDown({ flowLpm: active!.approvedFlowLpm!, periods: active!.periods }, policy);
        const requester = (await repos.infants.peopleNames([actor.id])).get(actor.id) ?? '';
        const full: StepDownEvidence = {
          ...evidence, kind: next.kind, label: next.label, checks, requestedBy: { id: actor.id, name: requester }, reason: input.reason,
          overrideReason: unmet.length ? input.overrideReason ?? null : null,
        };
        const rx = await openStepProposal(repos, infant, active, { reason: 'step_down', flowLpm: next.setting.flowLpm, periods: next.setting.periods, evidence: full }, actor.id, m);
        if (unmet.length) {
          await repos.audit.append({
            programmeId: infant.programmeId, actorId: actor.id, action: 'step_down.requested_against_rules', entityType: 'infant', entityId: infant.id, ip: actor.ip,
            details: { prescriptionId: rx.id, unmet: unmet.map((c) => c.code), overrideReason: input.overrideReason },
          }, m);
        }
        return rx;
      });
    },

    /**
     * After an overnight study is analysed: on target → propose the next step down; a follow-up after a step down
     * below target → propose stepping back up; off oxygen and on target after the observation period → propose
     * leaving the programme. Nothing is proposed while another proposal waits.
     */
    async considerStudy(infantId: string, study: StudyResult & { recordingId: string; recordedAt: Date }, now = new Date()) {
      return ds.transaction(async (m) => {
        const infant = await repos.infants.findForUpdate(infantId, m);
        if (!infant || ['preparing', 'awaiting_signoff', 'sent_back', 'left_programme'].includes(infant.status)) return null;
        if (await repos.prescriptions.hasPending(infantId, m)) return null;
        const policy = await repos.policies.current(infant.programmeId, m);
        const target = meetsOvernightTarget(study, policy.settings, infant.diagnoses.includes('pulmonary_hypertension'));
        // A study too short to judge says nothing either way: no flag raised or cleared, nothing proposed.
        if (!target.judged) return null;
        const active = await repos.prescriptions.active(infantId, m);
        const evidence = { recordingId: study.recordingId, meanSpo2: study.meanSpo2, pctBelow90: study.pctBelow90, validMinutes: study.validMinutes, targetMet: target.met, shortfalls: target.reasons };
        infant.flags = target.met ? infant.flags.filter((f) => f !== 'below_target') : [...new Set([...infant.flags, 'below_target' as const])];
        await repos.infants.save(infant, m);
        if (!active || !active.decidedAt || study.recordedAt < active.decidedAt) return null;
        if (infant.status === 'off_oxygen' && infant.offOxygenSince) {
          const observedDays = (study.recordedAt.getTime() - infant.offOxygenSince.getTime()) / 86_400_000;
          if (!target.met || observedDays < policy.settings.stepDown.offOxygenObservationDays) return null;
          return openStepProposal(repos, infant, active, { reason: 'leave_programme', flowLpm: 0, periods: null, evidence: { ...evidence, observedDays: Math.floor(observedDays) } }, null, m);
        }
        if (!target.met && active.reason === 'step_down') {
          const previous = await repos.prescriptions.lastSupersededWithFlow(infantId, m);
          if (!previous) return null;
          return openStepProposal(repos, infant, active, { reason: 'step_up', flowLpm: Number(previous.approved_flow_lpm), periods: previous.periods, evidence }, null, m);
        }
        const daysOnSetting = (study.recordedAt.getTime() - active.decidedAt.getTime()) / 86_400_000;
        if (!target.met || (active.approvedFlowLpm ?? 0) <= 0 || daysOnSetting < policy.settings.stepDown.minDaysBetweenStepDowns - 2) return null;
        if (active.approvedWeightKg !== null && infant.weightKg < active.approvedWeightKg) return null;
        const next = nextStepDown({ flowLpm: active.approvedFlowLpm!, periods: active.periods }, policy.settings);
        // Proposed by the system after a study on target: the consultant still sees every rule, met or not.
        const gathered = await gatherStepDownEvidence(repos, infant, active, policy.settings, now, m);
        const full: StepDownEvidence & typeof evidence = {
          ...evidence, ...gathered.evidence, checks: gathered.checks, kind: next.kind, label: next.label, requestedBy: null,
          reason: 'Proposed by Nestflow after an overnight study on target.', overrideReason: null,
        };
        return openStepProposal(repos, infant, active, { reason: 'step_down', flowLpm: next.setting.flowLpm, periods: next.setting.periods, evidence: full }, null, m);
      });
    },
  };
}
export type StepDownsService = ReturnType<typeof createStepDownsService>;
