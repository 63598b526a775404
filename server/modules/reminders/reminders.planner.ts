import type { EntityManager } from 'typeorm';
import { addDays } from '@shared/clinical/dates';
import { chooseChannel } from '@shared/reminders/recipient';
import { changeNoteAt, instantAtOrAfter, journeyReminderAt, localParts, outsideQuietHours, planBookingNote, planVisitReminders } from '@shared/reminders/timing';
import type { MessageTemplate } from '@shared/schemas/messages';
import type { PolicySettings } from '@shared/schemas/policy';
import type { FamilyContactEntity } from '../../db/entities/family-contact.entity';
import type { NewReminder } from '../../db/repositories/reminders.repository';
import type { AppRepos } from '../../deps';

export interface VisitFacts {
  id: string;
  programmeId: string;
  infantId: string;
  kind: 'home_visit' | 'clinic_review';
  startsAt: Date;
  localDate: string;
  localTime: string;
  timeZone: string;
  staffId: string;
  purpose: string;
  rowVersion: number;
}

function familyRow(c: FamilyContactEntity, template: MessageTemplate, kind: 'reminder' | 'change-note', base: Omit<NewReminder, 'template' | 'recipientName' | 'timeZone' | 'contactId'>): NewReminder {
  const choice = chooseChannel(c, kind);
  return {
    ...base, template, contactId: c.id, recipientName: c.name, language: c.language, timeZone: c.timeZone,
    ...('skip' in choice ? { status: 'skipped', reason: choice.skip } : { channel: choice.channel, toAddress: choice.address }),
  };
}

/**
 * Writes reminder rows inside the caller's transaction, so a reminder exists exactly when the change that causes it
 * was committed. Delivery happens later (BullMQ, with a reconciler as the safety net); nothing here sends.
 */
export function createReminderPlanner(repos: AppRepos) {
  async function visitData(v: VisitFacts, m: EntityManager) {
    const infant = await repos.reminderContent.infantGivenName(v.infantId, m);
    const staff = await repos.reminderContent.staffName(v.staffId, m);
    return {
      babyName: infant?.given_name ?? '', kind: v.kind, startsAt: v.startsAt.toISOString(), date: v.localDate, time: v.localTime,
      timeZone: v.timeZone, staffName: staff?.name ?? '', purpose: v.purpose,
    };
  }

  return {
    /**
     * The family's day-before and morning reminders for a booked (or moved) visit, one set per contact; with
     * `confirm` (a new booking) also the note that it was booked — "today at …" for a visit on the day itself, which
     * then stands in for that morning's reminder. A move needs none: its own note gives the new time.
     */
    async visitBooked(v: VisitFacts, settings: PolicySettings, m: EntityManager, now = new Date(), opts: { confirm?: boolean } = {}) {
      const contacts = await repos.contacts.listForInfant(v.infantId, m);
      const data = await visitData(v, m);
      const rows: NewReminder[] = [];
      for (const c of contacts) {
        // Each contact's own wall clock decides when "the day before" and "the morning" are.
        // The visit's date and time on this contact's clock (a relative abroad may be a day ahead or behind).
        const local = c.timeZone === v.timeZone ? { date: v.localDate, time: v.localTime } : localParts(v.startsAt, c.timeZone);
        const timing = { ...local, timeZone: c.timeZone, startsAt: v.startsAt };
        const note = opts.confirm ? planBookingNote(timing, settings.reminders, now) : null;
        if (note) {
          const row = familyRow(c, note.template, 'change-note', {
            programmeId: v.programmeId, infantId: v.infantId, visitId: v.id, data, sendAt: note.sendAt, notAfter: note.notAfter,
            dedupeKey: `visit-${v.id}-v${v.rowVersion}-${note.template}-${c.id}`,
          });
          rows.push(note.skip && row.status !== 'skipped' ? { ...row, status: 'skipped', reason: note.skip } : row);
        }
        const todayNoteGoes = note?.template === 'visit-today' && !note.skip;
        for (const p of planVisitReminders(timing, settings.reminders, now)) {
          if (todayNoteGoes && p.template === 'visit-morning') continue;
          const base = { programmeId: v.programmeId, infantId: v.infantId, visitId: v.id, data, sendAt: p.sendAt, notAfter: p.notAfter,
            dedupeKey: `visit-${v.id}-v${v.rowVersion}-${p.template}-${c.id}` };
          const row = familyRow(c, p.template, 'reminder', base);
          rows.push(p.skip && row.status !== 'skipped' ? { ...row, status: 'skipped', reason: p.skip } : row);
        }
      }
      return repos.reminders.insertMany(rows, m);
    },

    /** Moving or cancelling: the pending reminders go, and each contact gets a note (now, or when quiet hours end). */
    async visitChanged(v: VisitFacts, change: 'visit-moved' | 'visit-cancelled', settings: PolicySettings, m: EntityManager, now = new Date()) {
      await repos.reminders.cancelForVisit(v.id, m);
      if (v.startsAt.getTime() < now.getTime()) return [];
      const contacts = await repos.contacts.listForInfant(v.infantId, m);
      const data = await visitData(v, m);
      const rows = contacts.map((c) =>
        familyRow(c, change, 'change-note', {
          programmeId: v.programmeId, infantId: v.infantId, visitId: v.id, data, sendAt: changeNoteAt(now, c.timeZone, settings.reminders),
          dedupeKey: `visit-${v.id}-v${v.rowVersion}-${change}-${c.id}`,
        }),
      );
      const inserted = await repos.reminders.insertMany(rows, m);
      if (change === 'visit-moved') inserted.push(...(await this.visitBooked(v, settings, m, now)));
      return inserted;
    },

    /**
     * A proposal now waits for sign-off: each consultant of the programme gets (at most) one digest on the first
     * digest morning after the waiting time has passed. What the digest lists is read when it is sent.
     */
    async proposalWaiting(programmeId: string, createdAt: Date, settings: PolicySettings, m: EntityManager) {
      const programme = await repos.reminderContent.programmeTimeZone(programmeId, m);
      const tz: string = programme.time_zone;
      const consultants = await repos.reminderContent.activeConsultants(programmeId, m);
      const waitedBy = new Date(createdAt.getTime() + settings.reminders.signOffWaitingHours * 3_600_000);
      const local = localParts(waitedBy, tz);
      let day = local.date;
      if (instantAtOrAfter(day, settings.reminders.staffDigestAt, tz).getTime() < waitedBy.getTime()) day = addDays(day, 1);
      const sendAt = outsideQuietHours(instantAtOrAfter(day, settings.reminders.staffDigestAt, tz), tz, settings.reminders);
      return repos.reminders.insertMany(consultants.map((u) => ({
        programmeId, template: 'consultant-digest' as const, userId: u.id, recipientName: u.name, channel: 'email' as const, toAddress: u.email,
        timeZone: tz, data: { date: day }, dedupeKey: `consultant-digest-${u.id}-${day}`, sendAt,
      })), m);
    },

    /** The family's reminder the day before an approved journey. */
    async journeyApproved(j: { id: string; programmeId: string; infantId: string; departOn: string; data: Record<string, unknown> }, settings: PolicySettings, m: EntityManager, now = new Date()) {
      const contacts = await repos.contacts.listForInfant(j.infantId, m);
      const rows = contacts
        .map((c) => ({ c, sendAt: journeyReminderAt(j.departOn, c.timeZone, settings.reminders) }))
        .filter(({ sendAt }) => sendAt.getTime() > now.getTime() - 10 * 60_000)
        .map(({ c, sendAt }) => familyRow(c, 'journey-day-before', 'reminder', {
          programmeId: j.programmeId, infantId: j.infantId, data: j.data, sendAt, dedupeKey: `journey-${j.id}-day-before-${c.id}`,
        }));
      return repos.reminders.insertMany(rows, m);
    },
  };
}
export type ReminderPlanner = ReturnType<typeof createReminderPlanner>;
