import { defineAbilityFor } from '@shared/auth/ability';
import { addDays } from '@shared/clinical/dates';
import type { AppDeps } from '../server/deps';
import { todayIn } from '../server/lib/dates';
import { createJourneysService } from '../server/modules/journeys/journeys.service';
import { createStepDownsService } from '../server/modules/step-downs/step-downs.service';

const HOUR = 3_600_000;

/**
 * Work waiting in the demo, so each start-page figure has something behind it: two step downs asked for against
 * a rule (with the reason why), a second journey check, waits spread over the last days, and two family messages
 * the SMS service refused plus one e-mail of unknown outcome (written as such: a real failure cannot be ordered).
 */
export async function seedWaiting(deps: AppDeps, slug: string): Promise<number> {
  const { ds, repos } = deps;
  const [coord] = await ds.query(`SELECT u.id, u.programme_id, p.time_zone FROM users u JOIN programmes p ON p.id = u.programme_id WHERE u.email = $1`, [`coordinator@${slug}.example`]);
  if (!coord) return 0;
  const programmeId: string = coord.programme_id;
  const [done] = await ds.query(`SELECT 1 FROM audit_events WHERE programme_id = $1 AND action = 'step_down.requested_against_rules' LIMIT 1`, [programmeId]);
  if (done) return 0;
  const ability = defineAbilityFor({ id: coord.id, role: 'coordinator', programmeId });
  const actor = { id: coord.id, programmeId, ip: null };
  const calm: Array<{ id: string }> = await ds.query(
    `SELECT i.id FROM infants i JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'
      WHERE i.programme_id = $1 AND i.status = 'on_oxygen' AND p.approved_flow_lpm > 0
        AND NOT EXISTS (SELECT 1 FROM prescriptions x WHERE x.infant_id = i.id AND x.status IN ('preparing', 'proposed'))
        AND NOT EXISTS (SELECT 1 FROM journeys j WHERE j.infant_id = i.id)
      ORDER BY p.decided_at DESC, i.id LIMIT 3`, [programmeId]);
  const stepDowns = createStepDownsService(ds, repos);
  const reasons = [
    ['Settled on the last three visits and feeding well', 'The family moves abroad next month; the consultant asked for an early trial on lower flow'],
    ['Saturations steady on every spot check this fortnight', 'Overnight study booked late by the hospital; stepping down now with a repeat study in a week'],
  ];
  let n = 0;
  for (const [k, b] of calm.slice(0, 2).entries()) {
    await stepDowns.request(ability, actor, b.id, { reason: reasons[k][0], overrideReason: reasons[k][1] }, new Date());
    n++;
  }
  const today = todayIn(coord.time_zone);
  if (calm[2]) {
    await createJourneysService(ds, repos).create(ability, { ...actor, timeZone: coord.time_zone }, calm[2].id, {
      mode: 'road', destinationName: 'Cindermoor for a family wedding', destinationElevationM: 1780, departOn: addDays(today, 9), returnOn: addDays(today, 11),
      hoursAway: 50, notes: 'Two nights away; staying with relatives.',
    }, 'staff');
    n++;
  }
  // Demo only: what waits has waited a while, the oldest a few days.
  await ds.query(
    `UPDATE prescriptions p SET created_at = p.created_at - make_interval(hours => 6 + (abs(hashtext(p.id::text)) % 90))
      WHERE p.programme_id = $1 AND p.status = 'proposed'`, [programmeId]);
  await ds.query(`UPDATE journeys j SET created_at = j.created_at - make_interval(hours => 20 + (abs(hashtext(j.id::text)) % 40)) WHERE j.programme_id = $1 AND j.status = 'waiting'`, [programmeId]);
  // The unknown outcome only arises for e-mail (SMS has the provider's own list to settle it).
  const pick = async (channel: string, limit: number): Promise<Array<{ id: string }>> => ds.query(
    `SELECT id FROM reminders WHERE programme_id = $1 AND contact_id IS NOT NULL AND status = 'scheduled' AND channel = $2 ORDER BY send_at, id LIMIT $3`,
    [programmeId, channel, limit]);
  const demo = [...(await pick('sms', 2)).map((r) => ({ ...r, failed: true })), ...(await pick('email', 1)).map((r) => ({ ...r, failed: false }))];
  for (const [k, r] of demo.entries()) {
    await ds.query(
      `UPDATE reminders SET status = $2, reason = $3, attempts = 4, send_at = $4, last_error = $5, updated_at = now() WHERE id = $1`,
      [r.id, r.failed ? 'failed' : 'unknown', r.failed ? null : 'outcome-unknown', new Date(Date.now() - (8 + k * 13) * HOUR),
        r.failed ? 'Demo: the SMS service refused the number (not in service)' : null],
    );
    n++;
  }
  return n;
}
