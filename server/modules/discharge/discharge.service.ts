import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { dischargeClosed, missingEvidence, missingForDischarge } from '@shared/discharge/readiness';
import { withOrderTicks } from '@shared/discharge/order-ticks';
import { addDays } from '@shared/clinical/dates';
import type { Discharge, DischargeItem, SetDischargeInput, UpdateDischargeItemInput } from '@shared/schemas/discharge';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { InfantEntity } from '../../db/entities/infant.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { AppError, ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { systemClock, type Clock } from '../../lib/clock';
import { todayIn } from '../../lib/dates';
import { familyView, staffView } from './discharge.view';
import { orderTicksFor } from './order-ticks';
import { firstHomeVisit } from './first-visit';

export const fieldsOf = (i: InfantEntity) => ({ programmeId: i.programmeId, infantId: i.id, nurseId: i.nurseId } as Record<string, unknown>);

/** 422 with the keys still missing, so a client can name each step; `setting_approved` first when it applies. */
export class DischargeNotReadyError extends AppError {
  constructor(missing: string[]) {
    super(422, 'discharge_not_ready', 'The baby is not ready to go home: some steps are not done.', { missing });
  }
}

/** The checklist and the date are closed once the baby has left the programme (dischargeClosed, shared with the web). */
function assertOpen(infant: InfantEntity): void {
  if (dischargeClosed(infant.status)) throw new ConflictError('This baby has left the programme: the discharge checklist is closed.');
}

// How far from today a discharge date may be: a date just past is recorded late; a year ahead is a typing slip.
const PAST_DAYS = 28;
const AHEAD_DAYS = 365;

export type Audience = 'staff' | 'family';

export function createDischargeService(ds: DataSource, repos: AppRepos, clock: Clock = systemClock) {
  /** The baby, if the caller may read its discharge: another programme's or another caseload's baby is 404. */
  async function visibleInfant(ability: AppAbility, infantId: string, m?: EntityManager) {
    const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), m);
    if (!infant || !ability.can('read', subject('Discharge', fieldsOf(infant)))) throw new NotFoundError('No such baby in your records.');
    return infant;
  }

  async function settingApproved(infantId: string, m?: EntityManager) {
    const rx = await repos.prescriptions.active(infantId, m);
    return !!rx && rx.approvedFlowLpm !== null;
  }

  async function view(infant: InfantEntity, audience: Audience, m?: EntityManager): Promise<Discharge> {
    const [policy, states, step, approved] = await Promise.all([
      repos.policies.current(infant.programmeId, m), repos.discharges.itemsFor(infant.id, m), repos.discharges.stepFor(infant.id, m),
      settingApproved(infant.id, m),
    ]);
    const names = await repos.infants.peopleNames([...states.map((s) => s.doneBy), step?.setBy ?? null]);
    const firstVisit = step?.dischargedOn ? await firstHomeVisit(repos, infant.id, step.dischargedOn) : null;
    const orderTicks = await orderTicksFor(repos, infant, step?.dischargedOn ?? null, m);
    const facts = { rules: policy.settings.discharge.items, states, step, settingApproved: approved, names, firstVisit, orderTicks };
    return audience === 'family' ? familyView(facts) : staffView(facts);
  }

  return {
    async get(ability: AppAbility, infantId: string, audience: Audience): Promise<Discharge> {
      return view(await visibleInfant(ability, infantId), audience);
    },

    async updateItem(ability: AppAbility, actor: Actor, infantId: string, key: string, input: UpdateDischargeItemInput): Promise<DischargeItem> {
      const infant = await visibleInfant(ability, infantId);
      if (!ability.can('update', subject('Discharge', fieldsOf(infant)))) throw new ForbiddenError('You cannot change this baby’s discharge checklist.');
      assertOpen(infant);
      const policy = await repos.policies.current(infant.programmeId);
      const rule = policy.settings.discharge.items.find((r) => r.key === key);
      if (!rule) throw new NotFoundError('There is no such item on your programme’s discharge checklist.');
      if (input.done) {
        const errors = missingEvidence(rule, input.evidence);
        if (Object.keys(errors).length) throw new ValidationError(errors);
      }
      await ds.transaction(async (m) => {
        await repos.discharges.lockStep(infant.id, infant.programmeId, m);
        const before = (await repos.discharges.itemsFor(infant.id, m)).find((s) => s.key === key);
        const newlyDone = input.done && !before?.done;
        await repos.discharges.saveItem({
          infantId: infant.id, key, programmeId: infant.programmeId, done: input.done,
          doneBy: input.done ? (newlyDone ? actor.id : before!.doneBy) : null,
          doneAt: input.done ? (newlyDone ? clock.now() : before!.doneAt) : null,
          note: input.note ?? before?.note ?? '',
          // Only the evidence the item asks for is kept.
          evidence: input.done && rule.evidence.length ? Object.fromEntries(rule.evidence.map((k) => [k, input.evidence![k]!])) : null,
        }, m);
        await repos.audit.append({
          programmeId: infant.programmeId, actorId: actor.id, action: 'discharge.item_changed', entityType: 'infant', entityId: infant.id, ip: actor.ip,
          details: { key, label: rule.label, done: input.done, ...(input.note ? { note: input.note } : {}), ...(input.evidence ? { evidence: input.evidence } : {}) },
        }, m);
      });
      return (await view(infant, 'staff')).items.find((i) => i.key === key)!;
    },

    /**
     * Sets the discharge date when the setting is approved and the checklist complete; otherwise only a consultant,
     * giving a reason, may (recorded with what was missing). The first home visit is proposed at the policy's interval.
     */
    async setDate(ability: AppAbility, actor: Actor & { timeZone: string }, infantId: string, input: SetDischargeInput): Promise<Discharge> {
      const infant = await visibleInfant(ability, infantId);
      if (!ability.can('update', subject('Discharge', fieldsOf(infant)))) throw new ForbiddenError('You cannot set this baby’s discharge date.');
      assertOpen(infant);
      const today = todayIn(actor.timeZone, clock.now());
      if (input.date < addDays(today, -PAST_DAYS)) throw new ValidationError({ date: [`Use a date from ${PAST_DAYS} days ago on`] });
      if (input.date > addDays(today, AHEAD_DAYS)) throw new ValidationError({ date: ['Use a date within the next year'] });
      await ds.transaction(async (m) => {
        const step = await repos.discharges.lockStep(infant.id, infant.programmeId, m);
        const [policy, states, approved, ticks] = await Promise.all([
          repos.policies.current(infant.programmeId, m), repos.discharges.itemsFor(infant.id, m), settingApproved(infant.id, m),
          // Equipment counts as installed only when delivered on or before the date being set.
          orderTicksFor(repos, infant, input.date, m),
        ]);
        const missing = missingForDischarge(policy.settings.discharge.items, withOrderTicks(states, ticks), approved);
        const override = missing.length > 0;
        if (override && !input.overrideReason) throw new DischargeNotReadyError(missing);
        if (override && !ability.can('approve', subject('Discharge', fieldsOf(infant)))) {
          throw new ForbiddenError('Only a consultant can set the discharge date before every step is done.');
        }
        const firstVisitOn = addDays(input.date, policy.settings.discharge.firstVisitDaysAfterDischarge);
        const beforeDate = step.dischargedOn;
        Object.assign(step, {
          dischargedOn: input.date, setBy: actor.id, setAt: clock.now(), firstVisitOn,
          overrideReason: override ? input.overrideReason! : null, overrideMissing: override ? missing : [],
        });
        await repos.discharges.saveStep(step, m);
        await repos.audit.append({
          programmeId: infant.programmeId, actorId: actor.id, action: override ? 'discharge.date_overridden' : 'discharge.date_set',
          entityType: 'infant', entityId: infant.id, ip: actor.ip,
          details: { date: input.date, firstVisitOn, before: beforeDate, ...(override ? { reason: input.overrideReason, missing } : {}) },
        }, m);
      });
      return view(infant, 'staff');
    },
  };
}
export type DischargeService = ReturnType<typeof createDischargeService>;
