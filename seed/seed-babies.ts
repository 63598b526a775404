import { defineAbilityFor } from '@shared/auth/ability';
import { addDays } from '@shared/clinical/dates';
import type { EnrolInfantInput } from '@shared/schemas/infants';
import type { AppDeps } from '../server/deps';
import { todayIn } from '../server/lib/dates';
import type { Actor } from '../server/lib/http';
import { enrolInfant } from '../server/modules/infants/enrol';
import { updateInfant } from '../server/modules/infants/update';
import { computeProposal } from '../server/modules/prescriptions/compute-proposal';
import { decidePrescription } from '../server/modules/prescriptions/decide';
import { replan } from '../server/modules/schedule/planning';
import { DEMO_SITES, SALTMARSH_FAMILIES, demoBabies, type DemoBaby } from './demo-babies';
import { DEMO_PEOPLE } from './demo-people';

type Slug = keyof typeof DEMO_SITES;
const STREETS = ['Mill Lane', 'Quarry Row', 'Church Street', 'Heather Close', 'Station Road', 'Orchard Way', 'Kiln Lane'];

async function staff(deps: AppDeps, email: string): Promise<Actor & { role: string }> {
  const u = await deps.repos.users.findByEmail(email);
  if (!u) throw new Error(`demo person ${email} missing: seed people first`);
  return { id: u.id, programmeId: u.programmeId, ip: null, role: u.role };
}

function enrolment(b: DemoBaby, siteId: string, nurseId: string, consultantId: string, today: string, familyEmail: string | null): EnrolInfantInput {
  const birthDate = addDays(today, -b.ageDays);
  return {
    enrolKey: b.key,
    baby: {
      givenName: b.givenName, familyName: b.familyName, sex: b.sex, birthDate, gestation: { weeks: b.gaWeeks, days: b.gaDays },
      birthWeightG: b.birthWeightG, weightKg: b.weightKg, weightDate: addDays(today, -3), diagnoses: b.diagnoses as EnrolInfantInput['baby']['diagnoses'],
    },
    hospital: { siteId, flowLpm: b.hospitalFlowLpm, source: b.hospitalSource, o2Percent: b.hospitalO2Percent },
    home: { address: `${3 + (Number(b.key.slice(-3)) * 7) % 90} ${STREETS[Number(b.key.slice(-3)) % STREETS.length]}, ${b.town.name}`, location: { elevationM: b.town.elevationM }, source: b.homeSource, o2Percent: b.homeSource === 'cylinder' ? 100 : 95 },
    care: { nurseId, consultantId },
    contacts: [{
      // The baby with a family account is that person's baby: the contact carries their name.
      name: DEMO_PEOPLE.find((p) => p.email === familyEmail)?.name ?? `${b.sex === 'female' ? 'Sam' : 'Alex'} ${b.familyName}`, relation: 'Parent', mobile: `+447700900${String(100 + Number(b.key.slice(-3))).slice(-3)}`,
      email: familyEmail ?? `${b.familyName.toLowerCase()}.family@example.org`, preferredChannel: Number(b.key.slice(-1)) % 2 ? 'sms' : 'email',
      consentSms: true, consentEmail: true, language: 'en', timeZone: 'Europe/London',
    }],
  };
}

/** Moves one demo baby to its intended state through the same service functions the app uses. */
async function playOut(deps: AppDeps, b: DemoBaby, infantId: string, coordinator: Actor, consultant: Actor, today: string) {
  const { ds, repos } = deps;
  const pending = (await ds.query(`SELECT id FROM prescriptions WHERE infant_id = $1 AND status = 'preparing'`, [infantId])) as Array<{ id: string }>;
  for (const p of pending) await computeProposal(ds, repos, p.id);
  if (b.outcome === 'awaiting') return;
  const [rx] = (await ds.query(`SELECT id FROM prescriptions WHERE infant_id = $1 AND status = 'proposed'`, [infantId])) as Array<{ id: string }>;
  if (!rx) return;
  const consultantAbility = defineAbilityFor({ id: consultant.id, role: 'consultant', programmeId: consultant.programmeId });
  const proposal = await repos.prescriptions.findById(rx.id);
  const feasible = proposal?.proposedFlowLpm !== null;
  if (b.outcome === 'sent_back' || !feasible) {
    await decidePrescription(ds, repos, consultantAbility, consultant, rx.id, { decision: 'reject', reason: 'Please check the home elevation with the family before I sign this off.' });
    return;
  }
  await decidePrescription(ds, repos, consultantAbility, consultant, rx.id, { decision: 'approve' });
  if (b.outcome === 'drift') {
    const infant = await repos.infants.findByEnrolKey(coordinator.programmeId, b.key);
    const ability = defineAbilityFor({ id: coordinator.id, role: 'coordinator', programmeId: coordinator.programmeId });
    await updateInfant(ds, repos, ability, coordinator, infantId, { rowVersion: infant!.rowVersion, weightKg: Math.round((b.weightKg + 0.9) * 100) / 100, weightDate: today, weightConfirmed: true }, today);
    const [next] = (await ds.query(`SELECT id FROM prescriptions WHERE infant_id = $1 AND status = 'preparing'`, [infantId])) as Array<{ id: string }>;
    if (next) await computeProposal(ds, repos, next.id);
  }
  // Stepping down and leaving the programme have no screens yet; the demo shows those babies in their state.
  const later: Record<string, string> = { stepping_down: 'stepping_down', off_oxygen: 'off_oxygen', left: 'left_programme' };
  if (later[b.outcome]) await ds.query(`UPDATE infants SET status = $2 WHERE id = $1`, [infantId, later[b.outcome]]);
}

export async function seedBabies(deps: AppDeps, slug: Slug, count: number): Promise<number> {
  const { repos } = deps;
  const coordinator = await staff(deps, `coordinator@${slug}.example`);
  const consultant = await staff(deps, `consultant@${slug}.example`);
  const programme = await repos.programmes.findById(coordinator.programmeId);
  const today = todayIn(programme!.timeZone);
  let site = await repos.sites.findByName(coordinator.programmeId, DEMO_SITES[slug].name);
  site ??= await repos.sites.insert({ programmeId: coordinator.programmeId, ...DEMO_SITES[slug] });
  let added = 0;
  for (const [i, b] of demoBabies().slice(0, count).entries()) {
    if (await repos.infants.findByEnrolKey(coordinator.programmeId, b.key)) continue;
    const nurse = await staff(deps, slug === 'larkmoor' ? b.nurse : `nurse@${slug}.example`);
    const familyEmail = i === 10 ? `family@${slug}.example` : null;
    const baby: DemoBaby = slug === 'saltmarsh'
      ? { ...b, familyName: SALTMARSH_FAMILIES[i % SALTMARSH_FAMILIES.length], town: { name: 'Emberly', elevationM: 40 } }
      : b;
    const out = await enrolInfant(deps.ds, repos, coordinator, enrolment(baby, site.id, nurse.id, consultant.id, today, familyEmail), today);
    await playOut(deps, baby, out.infant.id, coordinator, consultant, today);
    // Demo only: spread the babies' time at home over the past weeks so schedules have history and due items.
    await deps.ds.query(
      `UPDATE prescriptions SET decided_at = decided_at - make_interval(days => $2) WHERE infant_id = $1 AND decided_at IS NOT NULL`,
      [out.infant.id, 2 + ((i * 5) % 45)],
    );
    added++;
  }
  if (added) await demoScheduleHistory(deps, coordinator.programmeId);
  return added;
}

/** Plans every demo baby's checks, then records the past ones as done, leaving a few overdue for the demo. */
async function demoScheduleHistory(deps: AppDeps, programmeId: string) {
  await replan(deps.repos, { programmeId });
  await deps.ds.query(
    `UPDATE checks c SET status = 'done', done_at = c.due_at - interval '3 hours', done_by = i.nurse_id, done_ref = 'demo'
       FROM infants i
      WHERE i.id = c.infant_id AND c.programme_id = $1 AND c.status = 'planned' AND c.due_at < now()`,
    [programmeId],
  );
  // One baby in five has missed its latest spot check, so the round shows what overdue looks like.
  await deps.ds.query(
    `UPDATE checks SET status = 'planned', done_at = NULL, done_by = NULL, done_ref = NULL
      WHERE id IN (SELECT DISTINCT ON (c.infant_id) c.id FROM checks c
                    WHERE c.programme_id = $1 AND c.done_ref = 'demo' AND c.kind = 'spot_check' AND abs(hashtext(c.infant_id::text)) % 5 = 0
                    ORDER BY c.infant_id, c.due_at DESC)`,
    [programmeId],
  );
  await deps.repos.checks.markOverdue();
}
