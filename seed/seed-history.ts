import { defineAbilityFor } from '@shared/auth/ability';
import { addDays } from '@shared/clinical/dates';
import type { EnrolInfantInput } from '@shared/schemas/infants';
import type { AppDeps } from '../server/deps';
import { todayIn } from '../server/lib/dates';
import type { Actor } from '../server/lib/http';
import { enrolInfant } from '../server/modules/infants/enrol';
import { computeProposal } from '../server/modules/prescriptions/compute-proposal';
import { decidePrescription } from '../server/modules/prescriptions/decide';
import { openStepProposal } from '../server/modules/step-downs/step-downs.service';

// Invented names for babies who were in the programme earlier in the year: demo only.
const FORMER = [
  ['Hazel', 'Ormsby'], ['Tobin', 'Greenhalgh'], ['Saffi', 'Winterbourne'], ['Ned', 'Aldercott'], ['Clover', 'Pitchford'], ['Amos', 'Rushmere'],
  ['Juno', 'Hathersage'], ['Perrin', 'Coldwell'], ['Marigold', 'Fenby'], ['Idris', 'Tanfield'], ['Blythe', 'Wellow'], ['Cato', 'Brimble'],
  ['Rosalind', 'Ketteridge'], ['Ansel', 'Marlowby'],
] as const;
const DAY = 86_400_000;
const ago = (days: number) => new Date(Date.now() - days * DAY);

async function person(deps: AppDeps, email: string): Promise<Actor> {
  const [u] = await deps.ds.query(`SELECT id, programme_id FROM users WHERE email = $1`, [email]);
  if (!u) throw new Error(`demo person ${email} missing: seed people first`);
  return { id: u.id, programmeId: u.programme_id, ip: null };
}

/** Ends a baby's oxygen through the services: a proposal with no oxygen (coming off, or leaving), approved. */
async function endOxygen(deps: AppDeps, consultant: Actor, infantId: string, reason: 'step_down' | 'leave_programme', at: Date) {
  const { ds, repos } = deps;
  const rxId = await ds.transaction(async (m) => {
    const infant = (await repos.infants.findForUpdate(infantId, m))!;
    const active = await repos.prescriptions.active(infantId, m);
    const evidence = { note: 'Demo history: the baby came off oxygen after a room-air study on target.' };
    return (await openStepProposal(repos, infant, active, { reason, flowLpm: 0, periods: null, evidence }, consultant.id, m)).id;
  });
  await decidePrescription(ds, repos, defineAbilityFor({ ...consultant, role: 'consultant' }), consultant, rxId, { decision: 'approve' });
  await ds.query(`UPDATE prescriptions SET created_at = $2, decided_at = $2 WHERE id = $1`, [rxId, at]);
  await ds.query(`UPDATE infants SET off_oxygen_since = CASE WHEN off_oxygen_since IS NULL THEN NULL ELSE $2::timestamptz END WHERE id = $1`, [infantId, at]);
}

/**
 * A year of programme history for the overview's month chart, through the same services as the app: babies who
 * were at home on oxygen earlier in the year and have since left, and a proper end to the oxygen of the demo babies
 * shown as off oxygen or left (the baby seed only sets their status).
 */
export async function seedHistory(deps: AppDeps, slug: string): Promise<number> {
  const { ds, repos } = deps;
  const coordinator = await person(deps, `coordinator@${slug}.example`);
  const consultant = await person(deps, `consultant@${slug}.example`);
  const nurse = await person(deps, `nurse@${slug}.example`);
  const programme = await repos.programmes.findById(coordinator.programmeId);
  const today = todayIn(programme!.timeZone);
  const [site] = await ds.query(`SELECT id FROM sites WHERE programme_id = $1 ORDER BY name LIMIT 1`, [coordinator.programmeId]);
  let added = 0;
  for (const [k, [givenName, familyName]] of FORMER.entries()) {
    const enrolKey = `00000000-0000-4000-9000-${String(k + 1).padStart(12, '0')}`;
    if (await repos.infants.findByEnrolKey(coordinator.programmeId, enrolKey)) continue;
    const startAgo = 345 - k * 18;
    const endAgo = Math.max(12, startAgo - (75 + ((k * 29) % 80)));
    const input: EnrolInfantInput = {
      enrolKey,
      baby: {
        givenName, familyName, sex: k % 2 ? 'male' : 'female', birthDate: addDays(today, -(startAgo + 70 + (k % 4) * 9)),
        gestation: { weeks: 25 + (k % 6), days: k % 7 }, birthWeightG: 700 + (k % 6) * 120, weightKg: 6.2 + (k % 5) * 0.3, weightDate: addDays(today, -3),
        diagnoses: ['chronic_lung_disease'],
      },
      hospital: { siteId: site.id, flowLpm: [0.1, 0.125, 0.25, 0.5][k % 4], source: 'cylinder', o2Percent: 100 },
      home: { address: `${10 + k} Fieldgate Row, Emberly`, location: { elevationM: 40 }, source: 'concentrator', o2Percent: 95 },
      care: { nurseId: nurse.id, consultantId: consultant.id },
      contacts: [{ name: `Jo ${familyName}`, relation: 'Parent', email: `${familyName.toLowerCase()}.former@example.org`, preferredChannel: 'email',
        consentSms: false, consentEmail: true, language: 'en', timeZone: 'Europe/London' }],
    };
    const out = await enrolInfant(ds, repos, coordinator, input, today);
    const [rx] = await ds.query(`SELECT id FROM prescriptions WHERE infant_id = $1 AND status = 'preparing'`, [out.infant.id]);
    await computeProposal(ds, repos, rx.id);
    await decidePrescription(ds, repos, defineAbilityFor({ ...consultant, role: 'consultant' }), consultant, rx.id, { decision: 'approve' });
    await ds.query(`UPDATE prescriptions SET created_at = $2, decided_at = $2 WHERE id = $1`, [rx.id, ago(startAgo)]);
    await ds.query(`UPDATE infants SET created_at = $2 WHERE id = $1`, [out.infant.id, ago(startAgo + 2)]);
    await endOxygen(deps, consultant, out.infant.id, 'leave_programme', ago(endAgo));
    added++;
  }
  // Demo babies shown off oxygen or gone, whose approved setting still holds oxygen: end it half-way through their time at home.
  const unfinished: Array<{ id: string; status: string; since: Date }> = await ds.query(
    `SELECT i.id, i.status, p.decided_at AS since FROM infants i JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'
      WHERE i.programme_id = $1 AND i.status IN ('off_oxygen', 'left_programme') AND p.approved_flow_lpm > 0`, [coordinator.programmeId]);
  for (const b of unfinished) {
    const end = new Date((new Date(b.since).getTime() + Date.now()) / 2);
    await endOxygen(deps, consultant, b.id, b.status === 'left_programme' ? 'leave_programme' : 'step_down', end);
  }
  return added;
}
