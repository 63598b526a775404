import { mayMarkVisitDone } from '@shared/schemas/visits';
import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { localToInstant } from '@shared/schedule/local-time';
import type { BookVisitInput, MoveVisitInput, Visit } from '@shared/schemas/visits';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { VisitEntity } from '../../db/entities/visit.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import type { JobProducer } from '../../jobs/producer';
import { systemClock, type Clock } from '../../lib/clock';
import { createReminderPlanner, type VisitFacts } from '../reminders/reminders.planner';

const fields = (i: InfantEntity) => ({ programmeId: i.programmeId, infantId: i.id, nurseId: i.nurseId } as Record<string, unknown>);

/** The family's wall clock: their first contact's time zone, else the programme's. */
async function familyTimeZone(repos: AppRepos, infant: InfantEntity, fallback: string, m?: EntityManager) {
  const [contact] = await repos.contacts.listForInfant(infant.id, m);
  return contact?.timeZone ?? fallback;
}

function instantOrError(date: string, time: string, timeZone: string): Date {
  const at = localToInstant(date, time, timeZone);
  if (!at) throw new ValidationError({ time: [`${time} does not exist on ${date} in ${timeZone} (the clocks go forward): choose another time`] });
  return at;
}

async function checkStaff(repos: AppRepos, staffId: string, programmeId: string) {
  const [person] = await repos.users.findInProgramme([staffId], programmeId);
  if (!person || person.disabled || !['nurse', 'coordinator', 'consultant'].includes(person.role)) {
    throw new ValidationError({ staffId: ['Choose a nurse, coordinator or consultant of your programme'] });
  }
}

const facts = (v: VisitEntity): VisitFacts => ({
  id: v.id, programmeId: v.programmeId, infantId: v.infantId, kind: v.kind, startsAt: v.startsAt, localDate: v.localDate, localTime: v.localTime,
  timeZone: v.timeZone, staffId: v.staffId, purpose: v.purpose, rowVersion: v.rowVersion,
});

export function createVisitsService(ds: DataSource, repos: AppRepos, jobs: JobProducer, clock: Clock = systemClock) {
  const planner = createReminderPlanner(repos);

  async function toDto(rows: VisitEntity[]): Promise<Visit[]> {
    const names = await repos.infants.peopleNames(rows.map((v) => v.staffId));
    return rows.map((v) => ({
      id: v.id, infantId: v.infantId, kind: v.kind, startsAt: v.startsAt.toISOString(), date: v.localDate, time: v.localTime, timeZone: v.timeZone,
      durationMinutes: v.durationMinutes, staff: { id: v.staffId, name: names.get(v.staffId) ?? '' }, purpose: v.purpose, status: v.status,
      cancelReason: v.cancelReason, rowVersion: v.rowVersion,
    }));
  }

  async function lockVisit(ability: AppAbility, id: string, m: EntityManager) {
    const visit = await repos.visits.findForUpdate(id, m);
    const infant = visit ? await repos.infants.findVisible(visit.infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), m) : null;
    if (!visit || !infant) throw new NotFoundError('No such visit in your records.');
    if (!ability.can('update', subject('Visit', fields(infant)))) throw new ForbiddenError('You cannot change visits for this baby.');
    if (visit.status !== 'booked') throw new ConflictError(`This visit is already ${visit.status}.`);
    return { visit, infant };
  }

  return {
    async book(ability: AppAbility, actor: Actor & { timeZone: string }, infantId: string, input: BookVisitInput) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      if (!ability.can('create', subject('Visit', fields(infant)))) throw new ForbiddenError('You cannot book visits for this baby.');
      await checkStaff(repos, input.staffId, infant.programmeId);
      const timeZone = await familyTimeZone(repos, infant, actor.timeZone);
      const startsAt = instantOrError(input.date, input.time, timeZone);
      const now = clock.now();
      if (startsAt.getTime() < now.getTime() - 3_600_000) throw new ValidationError({ date: ['That time has already passed'] });
      const visit = await ds.transaction(async (m) => {
        const v = await repos.visits.insert({
          programmeId: infant.programmeId, infantId: infant.id, kind: input.kind, startsAt, localDate: input.date, localTime: input.time, timeZone,
          durationMinutes: input.durationMinutes, staffId: input.staffId, purpose: input.purpose, status: 'booked', rowVersion: 1, createdBy: actor.id,
        }, m);
        await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: 'visit.booked', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { visitId: v.id, date: input.date, time: input.time, kind: input.kind } }, m);
        const reminders = await planner.visitBooked(facts(v), (await repos.policies.current(infant.programmeId, m)).settings, m, now, { confirm: true });
        return { v, reminders };
      });
      await jobs.enqueueReminders(visit.reminders);
      return (await toDto([visit.v]))[0];
    },

    async move(ability: AppAbility, actor: Actor, id: string, input: MoveVisitInput) {
      const saved = await ds.transaction(async (m) => {
        const { visit, infant } = await lockVisit(ability, id, m);
        if (visit.rowVersion !== input.rowVersion) throw new ConflictError('Someone else changed this visit meanwhile. Reload and try again.');
        if (input.staffId) await checkStaff(repos, input.staffId, infant.programmeId);
        const before = { date: visit.localDate, time: visit.localTime, staffId: visit.staffId };
        const date = input.date ?? visit.localDate;
        const time = input.time ?? visit.localTime;
        Object.assign(visit, {
          localDate: date, localTime: time, startsAt: instantOrError(date, time, visit.timeZone),
          durationMinutes: input.durationMinutes ?? visit.durationMinutes, staffId: input.staffId ?? visit.staffId, purpose: input.purpose ?? visit.purpose,
          rowVersion: visit.rowVersion + 1,
        });
        await repos.visits.save(visit, m);
        await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: 'visit.moved', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { visitId: visit.id, before, after: { date, time, staffId: visit.staffId } } }, m);
        const whenChanged = before.date !== date || before.time !== time;
        const settings = (await repos.policies.current(infant.programmeId, m)).settings;
        // A new time cancels the old reminders, tells the family and plans new ones; a new purpose or person only
        // re-plans the reminders, which carry both.
        const now = clock.now();
        const reminders = whenChanged
          ? await planner.visitChanged(facts(visit), 'visit-moved', settings, m, now)
          : (await repos.reminders.cancelForVisit(visit.id, m), await planner.visitBooked(facts(visit), settings, m, now));
        return { visit, reminders };
      });
      await jobs.enqueueReminders(saved.reminders);
      return (await toDto([saved.visit]))[0];
    },

    async cancel(ability: AppAbility, actor: Actor, id: string, reason: string) {
      const saved = await ds.transaction(async (m) => {
        const { visit, infant } = await lockVisit(ability, id, m);
        Object.assign(visit, { status: 'cancelled', cancelReason: reason, rowVersion: visit.rowVersion + 1 });
        await repos.visits.save(visit, m);
        await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: 'visit.cancelled', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { visitId: visit.id, date: visit.localDate, time: visit.localTime, reason } }, m);
        const reminders = await planner.visitChanged(facts(visit), 'visit-cancelled', (await repos.policies.current(infant.programmeId, m)).settings, m, clock.now());
        return { visit, reminders };
      });
      await jobs.enqueueReminders(saved.reminders);
      return (await toDto([saved.visit]))[0];
    },

    /**
     * A booked visit that took place: from an hour before its booked start (a nurse may be early), never for a
     * visit still to come. Its reminders not yet sent are cancelled; the audit line is the transaction's last write.
     */
    async complete(ability: AppAbility, actor: Actor, id: string, rowVersion: number) {
      const saved = await ds.transaction(async (m) => {
        const { visit, infant } = await lockVisit(ability, id, m);
        if (visit.rowVersion !== rowVersion) throw new ConflictError('Someone else changed this visit meanwhile. Reload and try again.');
        if (!mayMarkVisitDone(visit.startsAt, clock.now())) {
          throw new ConflictError('This visit is still to come: it can be marked done from an hour before its time. If it took place on another day, move it to then first.');
        }
        Object.assign(visit, { status: 'done', rowVersion: visit.rowVersion + 1 });
        await repos.visits.save(visit, m);
        await repos.reminders.cancelForVisit(visit.id, m);
        await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: 'visit.done', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { visitId: visit.id, date: visit.localDate, time: visit.localTime, kind: visit.kind } }, m);
        return visit;
      });
      return (await toDto([saved]))[0];
    },

    async list(ability: AppAbility, infantId: string) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant || !ability.can('read', subject('Visit', fields(infant)))) throw new NotFoundError('No such baby in your records.');
      return { items: await toDto(await repos.visits.forInfant(infantId, new Date(clock.now().getTime() - 28 * 86_400_000))) };
    },
  };
}
export type VisitsService = ReturnType<typeof createVisitsService>;
