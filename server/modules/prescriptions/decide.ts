import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import { effectiveFio2 } from '@shared/clinical/cannula';
import { FLOW_TOLERANCE_LPM } from '@shared/clinical/flowmeter';
import type { AppAbility } from '@shared/auth/ability';
import type { DecisionInput } from '@shared/schemas/prescriptions';
import { unmetInEvidence } from '@shared/schedule/step-down-rules';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { AppRepos } from '../../deps';
import { ConflictError, NotFoundError, ValidationError, type FieldErrors } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { draftAfterApproval } from '../equipment-orders/auto-drafts';

const unmetChecks = (rx: PrescriptionEntity): string[] => unmetInEvidence(rx.evidence).map((c) => c.code);

const STEP_CHANGE_REASONS: string[] = ['step_down', 'step_up', 'leave_programme'];
const isStep = (flow: number, steps: readonly number[]) => steps.some((s) => Math.abs(s - flow) <= FLOW_TOLERANCE_LPM);

/** Checks an approval against the programme's flowmeter and the never-below-required rule; returns the flow. */
function approvedFlow(rx: PrescriptionEntity, input: DecisionInput, steps: readonly number[]): number {
  const errors: FieldErrors = {};
  const flow = input.flowLpm ?? rx.proposedFlowLpm;
  if (flow === null || flow === undefined) {
    throw new ValidationError({ flowLpm: ['No cannula flow reaches the target here: choose a flow and give the reason, or send it back'] });
  }
  // Stopping oxygen is a step change to 0 L/min; a conversion proposal never proposes that.
  const offAllowed = STEP_CHANGE_REASONS.includes(rx.reason) && flow === 0;
  if (!offAllowed && !isStep(flow, steps)) errors.flowLpm = ["Choose one of the programme's flowmeter steps"];
  const changed = rx.proposedFlowLpm === null || Math.abs(flow - rx.proposedFlowLpm) > FLOW_TOLERANCE_LPM;
  // Compare with the exact computed requirement, not the rounded column copy.
  const required = rx.result?.home.requiredFlowLpm ?? rx.requiredFlowLpm;
  const belowRequired = required !== null && flow < required - FLOW_TOLERANCE_LPM;
  if (belowRequired && !input.reason) errors.reason = ['This flow is below the required flow: the reason must be recorded'];
  else if (changed && !input.reason) errors.reason = ['Say why you chose a different flow from the proposal'];
  for (const [period, value] of Object.entries(input.periods ?? {})) {
    if (value !== 0 && !isStep(value, steps)) errors[`periods.${period}`] = ["Choose one of the programme's flowmeter steps, or 0 for off"];
    // A part of the day below the computed requirement is a lower dose too: its reason must be recorded.
    else if (required !== null && value < required - FLOW_TOLERANCE_LPM && !input.reason) {
      errors[`periods.${period}`] = ['This is below the required flow: the reason must be recorded'];
    }
  }
  // Approving a step down that some programme rules did not support needs the consultant's own recorded reason.
  if (unmetChecks(rx).length && !input.reason) errors.reason = [`${unmetChecks(rx).length} step-down rule(s) not met: record why you approve anyway`];
  if (Object.keys(errors).length) throw new ValidationError(errors);
  return flow;
}

async function approve(repos: AppRepos, rx: PrescriptionEntity, infant: InfantEntity, input: DecisionInput, actor: Actor, m: EntityManager) {
  const policy = await repos.policies.current(rx.programmeId, m);
  const flow = approvedFlow(rx, input, policy.settings.flowmeterStepsLpm);
  const weightKg = Number((rx.input as { weightKg?: number }).weightKg ?? infant.weightKg);
  const previous = await repos.prescriptions.active(rx.infantId, m);
  if (previous) {
    previous.status = 'superseded';
    await repos.prescriptions.save(previous, m);
  }
  Object.assign(rx, {
    status: 'active', approvedFlowLpm: flow, approvedWeightKg: weightKg,
    // A proposed night-only plan stays so when approved as proposed; a consultant's own flow replaces it.
    periods: input.periods ?? (input.flowLpm === undefined ? rx.periods : null),
    approvedFio2: effectiveFio2(flow, weightKg, rx.sourceO2Percent / 100),
    decidedBy: actor.id, decidedAt: new Date(), decisionReason: input.reason ?? null,
  });
  await repos.prescriptions.save(rx, m);
  nextStatus(rx, infant);
  infant.flags = infant.flags.filter((f) => f !== 'new_setting_waiting' && f !== 'growth_drift');
}

/** Where the baby is in the programme after an approval. */
function nextStatus(rx: PrescriptionEntity, infant: InfantEntity) {
  const noOxygen = (rx.approvedFlowLpm ?? 0) === 0 && !(rx.periods && Object.values(rx.periods).some((v) => v > 0));
  if (rx.reason === 'leave_programme') {
    infant.status = 'left_programme';
  } else if (noOxygen) {
    infant.status = 'off_oxygen';
    infant.offOxygenSince = new Date();
  } else if (rx.reason === 'step_down') {
    infant.status = 'stepping_down';
  } else if (['preparing', 'awaiting_signoff', 'sent_back'].includes(infant.status)) {
    infant.status = 'on_oxygen';
  }
  if (!noOxygen) infant.offOxygenSince = null;
  infant.flags = infant.flags.filter((f) => f !== 'below_target');
}

async function reject(repos: AppRepos, rx: PrescriptionEntity, infant: InfantEntity, input: DecisionInput, actor: Actor, m: EntityManager) {
  Object.assign(rx, { status: 'rejected', decidedBy: actor.id, decidedAt: new Date(), decisionReason: input.reason ?? null });
  await repos.prescriptions.save(rx, m);
  const hasActive = !!(await repos.prescriptions.active(rx.infantId, m));
  infant.flags = infant.flags.filter((f) => f !== 'new_setting_waiting');
  if (!hasActive) infant.status = 'sent_back';
}

/** A consultant's decision. The row lock makes two simultaneous decisions run one after the other: the second sees 409. */
export async function decidePrescription(ds: DataSource, repos: AppRepos, ability: AppAbility, actor: Actor, id: string, input: DecisionInput, now: Date = new Date()) {
  return ds.transaction(async (m) => {
    const rx = await repos.prescriptions.findForUpdate(id, m);
    if (!rx || !ability.can('approve', subject('Prescription', { programmeId: rx.programmeId, infantId: rx.infantId, status: rx.status } as Record<string, unknown>))) {
      throw new NotFoundError('No such proposal in your programme.');
    }
    if (rx.status !== 'proposed') throw new ConflictError(`This setting has already been dealt with (now: ${rx.status}).`);
    const infant = await repos.infants.findForUpdate(rx.infantId, m);
    if (!infant) throw new NotFoundError();
    const wasOffOxygen = infant.status === 'off_oxygen' || infant.status === 'left_programme';
    await (input.decision === 'approve' ? approve : reject)(repos, rx, infant, input, actor, m);
    // Equipment follows the setting: a collection or a change of concentrator is drafted for the coordinator (issue 16).
    if (input.decision === 'approve') await draftAfterApproval(repos, m, infant, rx, wasOffOxygen, now);
    infant.rowVersion += 1;
    await repos.infants.save(infant, m);
    await repos.audit.append(
      {
        programmeId: rx.programmeId, actorId: actor.id, action: `prescription.${input.decision === 'approve' ? 'approved' : 'rejected'}`,
        entityType: 'infant', entityId: rx.infantId, ip: actor.ip,
        details: { prescriptionId: rx.id, version: rx.version, proposedFlowLpm: rx.proposedFlowLpm, approvedFlowLpm: rx.approvedFlowLpm, reason: input.reason ?? null,
          ...(input.decision === 'approve' && unmetChecks(rx).length ? { approvedAgainstRules: unmetChecks(rx) } : {}) },
      },
      m,
    );
    return rx;
  });
}
