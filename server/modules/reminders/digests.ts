import type { DataSource } from 'typeorm';
import { instantAtOrAfter, localParts, outsideQuietHours } from '@shared/reminders/timing';
import type { AppRepos } from '../../deps';
import type { NewReminder } from '../../db/repositories/reminders.repository';

/** A morning digest not sent by this local time is left out: by the afternoon the day has moved on. */
export const DIGEST_LAST_USEFUL_TIME = '12:00';

/**
 * Morning digests for today in each programme's time zone: one for every active nurse, and one for every consultant
 * when proposals have waited longer than the policy allows. Run often (a job scheduler); the dedupe key makes a
 * repeat run, or a second worker, a no-op. Whether a digest has anything in it is decided when it is sent.
 */
export async function planDigests(ds: DataSource, repos: AppRepos, now = new Date()): Promise<Array<{ id: string; send_at: Date; status: string }>> {
  const programmes = await repos.reminderContent.programmeZones();
  const created: Array<{ id: string; send_at: Date; status: string }> = [];
  for (const p of programmes) {
    const { date, time } = localParts(now, p.time_zone);
    if (time >= DIGEST_LAST_USEFUL_TIME) continue;
    const settings = (await repos.policies.current(p.id)).settings;
    const sendAt = outsideQuietHours(instantAtOrAfter(date, settings.reminders.staffDigestAt, p.time_zone), p.time_zone, settings.reminders);
    const notAfter = instantAtOrAfter(date, DIGEST_LAST_USEFUL_TIME, p.time_zone);
    const waitingSince = new Date(now.getTime() - settings.reminders.signOffWaitingHours * 3_600_000);
    const people = await repos.reminderContent.digestRecipients(p.id, waitingSince);
    const rows: NewReminder[] = people.map((u) => ({
      programmeId: p.id, template: u.role === 'nurse' ? 'nurse-digest' : 'consultant-digest', userId: u.id, recipientName: u.name,
      channel: 'email', toAddress: u.email, timeZone: p.time_zone, data: { date }, sendAt, notAfter,
      dedupeKey: `${u.role}-digest-${u.id}-${date}`,
    }));
    if (rows.length) created.push(...(await ds.transaction((m) => repos.reminders.insertMany(rows, m))));
  }
  return created;
}
