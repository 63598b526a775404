import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { AIRCRAFT_CABIN_MAX_ALTITUDE_FT } from '@shared/clinical/journey';
import { planJourney } from '@shared/clinical/journey-plan';
import { journeyDateErrors, type CreateJourneyInput, type Journey, type JourneyDecisionInput } from '@shared/schemas/journeys';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { JourneyEntity } from '../../db/entities/journey.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { JOURNEY_ACL_COLUMNS, type JourneyWithInfant } from '../../db/repositories/journeys.repository';
import type { AppRepos } from '../../deps';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { todayIn } from '../../lib/dates';
import { toJourneyDto, type Audience } from './journeys.mapper';
import { journeyPlanInputFor } from './plan-input';
import { createReminderPlanner } from '../reminders/reminders.planner';
import { PERIOD_LABELS, flowText } from '@shared/family/care-text';

const fields = (i: { programmeId: string; id: string; nurseId: string | null }) => ({ programmeId: i.programmeId, infantId: i.id, nurseId: i.nurseId } as Record<string, unknown>);

/** What the family's day-before message says: the approved flow there per part of the day and the cylinders to take. */
function journeyReminderData(j: JourneyEntity, babyName: string) {
  const flows = j.plan.periods.filter((p) => p.flowLpm !== null && p.flowLpm > 0);
  const same = flows.every((p) => p.flowLpm === flows[0]?.flowLpm);
  const flow = flows.length === 0 ? 'no oxygen needed' : same ? flowText(flows[0].flowLpm!) : flows.map((p) => `${flowText(p.flowLpm!)} ${PERIOD_LABELS[p.period].toLowerCase()}`).join(', ');
  const cylinders = j.plan.cylinders.filter((c) => c.count).map((c) => `${c.count} × ${c.name}`);
  return {
    babyName, destination: j.destinationName, departOn: j.departOn, flight: j.mode === 'flight', flowText: flow,
    cylindersText: cylinders.length ? cylinders.join(' or ') : 'the cylinders your team agreed',
  };
}

export function createJourneysService(ds: DataSource, repos: AppRepos) {
  async function toDtos(rows: JourneyWithInfant[], audience: Audience): Promise<Journey[]> {
    const names = await repos.infants.peopleNames(rows.flatMap((r) => [r.journey.requestedBy, r.journey.decidedBy]));
    return rows.map((r) => toJourneyDto(r.journey, r.infantName, names, audience));
  }
  const one = async (j: JourneyEntity, infantName: string, audience: Audience) => (await toDtos([{ journey: j, infantName }], audience))[0];

  /** The family's own calendar decides whether a date has passed (their first contact's zone, else the programme's). */
  async function familyToday(infant: InfantEntity, fallbackZone: string) {
    const [contact] = await repos.contacts.listForInfant(infant.id);
    return todayIn(contact?.timeZone ?? fallbackZone);
  }

  async function activeSetting(infantId: string, m?: EntityManager) {
    const rx = await repos.prescriptions.active(infantId, m);
    if (!rx || rx.approvedFlowLpm === null) {
      throw new ConflictError('This baby has no approved oxygen setting yet, so a journey cannot be worked out.');
    }
    return rx;
  }

  return {
    async create(ability: AppAbility, actor: Actor & { timeZone: string }, infantId: string, input: CreateJourneyInput, audience: Audience) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      if (!ability.can('create', subject('Journey', fields(infant)))) throw new ForbiddenError('You cannot ask for journey checks for this baby.');
      const dateErrors = journeyDateErrors(input, await familyToday(infant, actor.timeZone));
      if (Object.keys(dateErrors).length) throw new ValidationError(dateErrors);
      const rx = await activeSetting(infant.id);
      const policy = await repos.policies.current(infant.programmeId);
      const request = { ...input, cabinAltitudeFt: input.mode === 'flight' ? input.cabinAltitudeFt ?? AIRCRAFT_CABIN_MAX_ALTITUDE_FT : null };
      const plan = planJourney(journeyPlanInputFor(infant, rx, policy.settings, request));
      const journey = await ds.transaction(async (m) => {
        const j = await repos.journeys.insert({
          programmeId: infant.programmeId, infantId: infant.id, prescriptionId: rx.id, policyVersion: policy.version, status: 'waiting', rowVersion: 1,
          mode: request.mode, destinationName: request.destinationName, destinationElevationM: request.destinationElevationM ?? null,
          cabinAltitudeFt: request.cabinAltitudeFt, departOn: request.departOn, returnOn: request.returnOn, hoursAway: request.hoursAway,
          notes: request.notes || null, plan, requestedBy: actor.id,
        }, m);
        await repos.audit.append({
          programmeId: infant.programmeId, actorId: actor.id, action: 'journey.requested', entityType: 'infant', entityId: infant.id, ip: actor.ip,
          details: { journeyId: j.id, mode: j.mode, destinationName: j.destinationName, departOn: j.departOn, returnOn: j.returnOn, prescriptionId: rx.id, exceedsCannula: plan.exceedsCannula },
        }, m);
        // Waiting for a consultant like a proposed setting: the consultants' digest is planned with it.
        await createReminderPlanner(repos).proposalWaiting(infant.programmeId, new Date(), policy.settings, m);
        return j;
      });
      return one(journey, `${infant.givenName} ${infant.familyName}`, audience);
    },

    async listForInfant(ability: AppAbility, infantId: string, audience: Audience) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant || !ability.can('read', subject('Journey', fields(infant)))) throw new NotFoundError('No such baby in your records.');
      return { items: await toDtos(await repos.journeys.listForInfant(infantId, accessibleWhere(ability, 'read', 'Journey', JOURNEY_ACL_COLUMNS)), audience) };
    },

    async get(ability: AppAbility, id: string, audience: Audience) {
      const row = await repos.journeys.findVisible(id, accessibleWhere(ability, 'read', 'Journey', JOURNEY_ACL_COLUMNS));
      if (!row) throw new NotFoundError('No such journey check in your records.');
      return (await toDtos([row], audience))[0];
    },

    async waiting(ability: AppAbility) {
      const rows = await repos.journeys.waiting(accessibleWhere(ability, 'read', 'Journey', JOURNEY_ACL_COLUMNS));
      return { items: await toDtos(rows, 'staff') };
    },

    /** The row lock makes two simultaneous decisions run one after the other: the second sees 409. */
    async decide(ability: AppAbility, actor: Actor, id: string, input: JourneyDecisionInput) {
      const { journey, infantName } = await ds.transaction(async (m) => {
        const j = await repos.journeys.findForUpdate(id, m);
        if (!j || !ability.can('approve', subject('Journey', { programmeId: j.programmeId, infantId: j.infantId } as Record<string, unknown>))) {
          throw new NotFoundError('No such journey check in your programme.');
        }
        if (j.status !== 'waiting') throw new ConflictError(`This journey check has already been decided (now: ${j.status}).`);
        if (j.rowVersion !== input.rowVersion) throw new ConflictError('This journey check changed meanwhile. Reload and try again.');
        const infant = await repos.infants.findForUpdate(j.infantId, m);
        if (!infant) throw new NotFoundError();
        if (input.decision === 'approve') {
          const rx = await repos.prescriptions.active(j.infantId, m);
          if (rx?.id !== j.prescriptionId) {
            throw new ConflictError("The baby's approved setting has changed since this check was worked out: decline it and ask for a new check.");
          }
          if (j.plan.exceedsCannula && !input.reason) {
            throw new ValidationError({ reason: ['The flow needed there is beyond the cannula: record why you approve this plan'] });
          }
        }
        Object.assign(j, {
          status: input.decision === 'approve' ? 'approved' : 'declined', decidedBy: actor.id, decidedAt: new Date(),
          decisionReason: input.reason || null, rowVersion: j.rowVersion + 1,
        });
        await repos.journeys.save(j, m);
        await repos.audit.append({
          programmeId: j.programmeId, actorId: actor.id, action: `journey.${j.status}`, entityType: 'infant', entityId: j.infantId, ip: actor.ip,
          details: { journeyId: j.id, reason: j.decisionReason, destinationName: j.destinationName, departOn: j.departOn },
        }, m);
        if (input.decision === 'approve') {
          await createReminderPlanner(repos).journeyApproved(
            { id: j.id, programmeId: j.programmeId, infantId: j.infantId, departOn: j.departOn, data: journeyReminderData(j, infant.givenName) },
            (await repos.policies.current(j.programmeId, m)).settings, m,
          );
        }
        return { journey: j, infantName: `${infant.givenName} ${infant.familyName}` };
      });
      return one(journey, infantName, 'staff');
    },
  };
}
export type JourneysService = ReturnType<typeof createJourneysService>;
