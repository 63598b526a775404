import { defineAbilityFor } from '@shared/auth/ability';
import { addDays } from '@shared/clinical/dates';
import { localParts } from '@shared/reminders/timing';
import type { AppDeps } from '../server/deps';
import { createVisitsService } from '../server/modules/visits/visits.service';

/**
 * Demo visits for the nurse's round, booked through the visits service, so their reminders are planned the way
 * the app plans them: one today (later than now), and a few over the coming days.
 */
export async function seedVisits(deps: AppDeps, programmeSlug: string): Promise<number> {
  const { ds, repos } = deps;
  const already = await ds.query(`SELECT 1 FROM visits v JOIN programmes p ON p.id = v.programme_id WHERE p.slug = $1 LIMIT 1`, [programmeSlug]);
  if (already.length) return 0;
  const babies: Array<{ id: string; nurse_id: string }> = await ds.query(
    // The demo nurse's own babies first, so their round shows visits.
    `SELECT i.id, i.nurse_id FROM infants i JOIN programmes pr ON pr.id = i.programme_id JOIN users u ON u.id = i.nurse_id
      WHERE pr.slug = $1 AND i.status IN ('on_oxygen', 'stepping_down')
      ORDER BY (u.email LIKE 'nurse@%') DESC, i.family_name, i.given_name LIMIT 5`,
    [programmeSlug],
  );
  const [coordinator] = await ds.query(
    `SELECT u.id FROM users u JOIN programmes p ON p.id = u.programme_id WHERE p.slug = $1 AND u.role = 'coordinator' ORDER BY u.email LIMIT 1`, [programmeSlug]);
  if (!coordinator || babies.length === 0) return 0;
  const user = (await repos.users.findSessionUser(coordinator.id))!;
  const ability = defineAbilityFor({ id: user.id, role: 'coordinator', programmeId: user.programmeId });
  const actor = { id: user.id, programmeId: user.programmeId, ip: null, role: 'coordinator', timeZone: user.programmeTimeZone };
  const visits = createVisitsService(ds, repos, deps.jobs);
  const now = localParts(new Date(), user.programmeTimeZone);
  // Today's visit at the next whole hour of the working day (09:00–18:00), else tomorrow morning.
  const nextHour = Math.max(9, Number(now.time.slice(0, 2)) + 1);
  const plan = [
    nextHour <= 18 ? { date: now.date, time: `${String(nextHour).padStart(2, '0')}:00` } : { date: addDays(now.date, 1), time: '09:30' },
    { date: addDays(now.date, 1), time: '11:00' },
    { date: addDays(now.date, 2), time: '14:30' },
    { date: addDays(now.date, 5), time: '10:00' },
    { date: addDays(now.date, 9), time: '15:00' },
  ];
  const purposes = ['Spot check and weight', 'Overnight oximeter set-up', 'Flowmeter and cylinder check', 'Step-down review at home', 'Clinic review with the consultant'];
  let n = 0;
  for (const [k, b] of babies.entries()) {
    await visits.book(ability, actor, b.id, {
      kind: k === 4 ? 'clinic_review' : 'home_visit', date: plan[k].date, time: plan[k].time, durationMinutes: k === 4 ? 30 : 45,
      staffId: b.nurse_id, purpose: purposes[k],
    });
    n++;
  }
  return n;
}
