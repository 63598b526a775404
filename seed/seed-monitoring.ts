import { defineAbilityFor } from '@shared/auth/ability';
import type { AppDeps } from '../server/deps';
import { createReadingsService } from '../server/modules/readings/readings.service';
import { storeUpload } from '../server/modules/recordings/upload';
import { analyseRecording } from '../server/modules/recordings/analyse';
import { afterStudy } from '../server/modules/step-downs/after-study';
import { demoOvernightCsv } from './demo-oximetry';

/** Demo readings and overnight recordings for a handful of babies at home, through the same services as the app. */
export async function seedMonitoring(deps: AppDeps, programmeSlug: string): Promise<number> {
  const { ds, repos } = deps;
  // Idempotent: once the demo has readings in this programme, a second run adds none.
  const already = await ds.query(`SELECT 1 FROM readings r JOIN programmes p ON p.id = r.programme_id WHERE p.slug = $1 LIMIT 1`, [programmeSlug]);
  if (already.length) return 0;
  const babies: Array<{ id: string; nurse_id: string; programme_id: string; approved: Date }> = await ds.query(
    `SELECT i.id, i.nurse_id, i.programme_id, p.decided_at AS approved FROM infants i
       JOIN programmes pr ON pr.id = i.programme_id JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'
      WHERE pr.slug = $1 AND i.status IN ('on_oxygen', 'stepping_down')
      ORDER BY i.family_name, i.given_name LIMIT 8`,
    [programmeSlug],
  );
  let seeded = 0;
  for (const [n, b] of babies.entries()) {
    const nurse = await repos.users.findSessionUser(b.nurse_id);
    if (!nurse) continue;
    const ability = defineAbilityFor({ id: nurse.id, role: 'nurse', programmeId: nurse.programmeId });
    const actor = { id: nurse.id, programmeId: nurse.programmeId, ip: null, role: 'nurse', timeZone: nurse.programmeTimeZone };
    const readings = createReadingsService(ds, repos, deps.jobs);
    for (let k = 3; k >= 1; k--) {
      const takenAt = new Date(Date.now() - k * 4 * 86_400_000 + n * 3_600_000).toISOString();
      await readings.create(ability, actor, b.id, { takenAt, spo2: 93 + ((n + k) % 5), pulse: 128 + ((n * 7 + k) % 20), state: k % 2 ? 'asleep' : 'awake' });
    }
    const night = new Date(Date.now() - 86_400_000);
    night.setUTCHours(21, 0, 0, 0);
    const csv = demoOvernightCsv(night.toISOString(), 9, n + 1, n % 4 === 3 ? 92 : 96);
    const { id } = await storeUpload(ds, repos, ability, actor, b.id, { buffer: Buffer.from(csv), originalname: `overnight-${night.toISOString().slice(0, 10)}.csv` }, { timeFormat: 'auto' });
    await analyseRecording(ds, repos, id);
    await afterStudy(ds, repos, id);
    seeded++;
  }
  return seeded;
}
