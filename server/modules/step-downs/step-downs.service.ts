import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import { nextStepDown, meetsOvernightTarget, type StudyResult } from '../../../shared/schedule/step-down';
import type { AppAbility } from '../../../shared/auth/ability';
import type { PrescriptionReason } from '../../../shared/schemas/prescriptions';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { createReminderPlanner } from '../reminders/reminders.planner';
import { ConflictError, ForbiddenError, NotFoundError } from '../../lib/errors';
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
  return {
    /** A nurse or coordinator asks for the next step down with a reason; the consultant decides. */
    async request(ability: AppAbility, actor: Actor, infantId: string, reason: string) {
      return ds.transaction(async (m) => {
        const visible = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), m);
        if (!visible) throw new NotFoundError('No such baby in your records.');
        if (!ability.can('create', subject('StepDown', { programmeId: visible.programmeId, nurseId: visible.nurseId } as Record<string, unknown>))) throw new ForbiddenError();
        const infant = (await repos.infants.findForUpdate(infantId, m))!;
        const active = await repos.prescriptions.active(infantId, m);
        if (!active || (active.approvedFlowLpm ?? 0) <= 0) throw new ConflictError('This baby has no oxygen to step down from.');
        const pending = await m.query(`SELECT 1 FROM prescriptions WHERE infant_id = $1 AND status IN ('preparing','proposed') LIMIT 1`, [infantId]);
        if (pending.length) throw new ConflictError('A new setting is already waiting for sign-off for this baby.');
        const policy = await repos.policies.current(infant.programmeId, m);
        const next = nextStepDown({ flowLpm: active.approvedFlowLpm!, periods: active.periods }, policy.settings);
        // The consultant decides on evidence: attach the latest analysed overnight study, if any.
        const [study] = await m.query(
          `SELECT id, mean_spo2, pct_below_90, valid_minutes FROM recordings WHERE infant_id = $1 AND status = 'done' ORDER BY coalesce(started_at, uploaded_at) DESC LIMIT 1`,
          [infantId],
        );
        const studyEvidence = study
          ? (() => {
              const s = { meanSpo2: study.mean_spo2, pctBelow90: study.pct_below_90, validMinutes: study.valid_minutes };
              const target = meetsOvernightTarget(s, policy.settings, infant.diagnoses.includes('pulmonary_hypertension'));
              return { recordingId: study.id, ...s, targetMet: target.met, shortfalls: target.reasons };
            })()
          : {};
        return openStepProposal(repos, infant, active, {
          reason: 'step_down', flowLpm: next.setting.flowLpm, periods: next.setting.periods,
          evidence: { ...studyEvidence, kind: next.kind, label: next.label, requestedBy: actor.id, requestReason: reason },
        }, actor.id, m);
      });
    },

    /**
     * After an overnight study is analysed: on target → propose the next step down; a follow-up after a step down
     * below target → propose stepping back up; off oxygen and on target after the observation period → propose
     * leaving the programme. Nothing is proposed while another proposal waits.
     */
    async considerStudy(infantId: string, study: StudyResult & { recordingId: string; recordedAt: Date }) {
      return ds.transaction(async (m) => {
        const infant = await repos.infants.findForUpdate(infantId, m);
        if (!infant || ['preparing', 'awaiting_signoff', 'sent_back', 'left_programme'].includes(infant.status)) return null;
        const pending = await m.query(`SELECT 1 FROM prescriptions WHERE infant_id = $1 AND status IN ('preparing','proposed') LIMIT 1`, [infantId]);
        if (pending.length) return null;
        const policy = await repos.policies.current(infant.programmeId, m);
        const target = meetsOvernightTarget(study, policy.settings, infant.diagnoses.includes('pulmonary_hypertension'));
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
          const previous = await m.query(`SELECT approved_flow_lpm, periods FROM prescriptions WHERE infant_id = $1 AND status = 'superseded' AND approved_flow_lpm > 0 ORDER BY version DESC LIMIT 1`, [infantId]);
          if (!previous.length) return null;
          return openStepProposal(repos, infant, active, { reason: 'step_up', flowLpm: Number(previous[0].approved_flow_lpm), periods: previous[0].periods, evidence }, null, m);
        }
        const daysOnSetting = (study.recordedAt.getTime() - active.decidedAt.getTime()) / 86_400_000;
        if (!target.met || (active.approvedFlowLpm ?? 0) <= 0 || daysOnSetting < policy.settings.stepDown.minDaysBetweenStepDowns - 2) return null;
        if (active.approvedWeightKg !== null && infant.weightKg < active.approvedWeightKg) return null;
        const next = nextStepDown({ flowLpm: active.approvedFlowLpm!, periods: active.periods }, policy.settings);
        return openStepProposal(repos, infant, active, { reason: 'step_down', flowLpm: next.setting.flowLpm, periods: next.setting.periods, evidence: { ...evidence, kind: next.kind, label: next.label } }, null, m);
      });
    },
  };
}
export type StepDownsService = ReturnType<typeof createStepDownsService>;
