import { defineAbilityFor, type AbilityUser } from '@shared/auth/ability';
import { addDays } from '@shared/clinical/dates';
import { DEFAULT_DISCHARGE_RULES } from '@shared/schemas/discharge-policy';
import { localParts } from '@shared/reminders/timing';
import type { AppDeps } from '../server/deps';
import { createDischargeService } from '../server/modules/discharge/discharge.service';
import { demoPerson } from './seed-people';

// Fictional evidence for the demo: the Larkmoor community nurses.
const EVIDENCE = { person: 'Nurse Tamsin Reed (Larkmoor community team)' };
const ALL = DEFAULT_DISCHARGE_RULES.items.map((i) => i.key);

/**
 * Babies at every stage of discharge, through the discharge service (so the audit trail is the real one): one part
 * done (three steps left: the home assessment, smoke alarms and the community team's letter), one ready with no
 * date yet, one going home in three days with the first visit proposed, one a consultant let go before the smoke
 * alarms were checked (with the reason), and one already home. The rest have not started.
 */
export async function seedDischarges(deps: AppDeps, programmeSlug: string): Promise<number> {
  const { ds, repos } = deps;
  const already = await ds.query(`SELECT 1 FROM discharge_items d JOIN programmes p ON p.id = d.programme_id WHERE p.slug = $1 LIMIT 1`, [programmeSlug]);
  if (already.length) return 0;
  const person = (email: string) => demoPerson(deps, email);
  const coordinator = await person(`coordinator@${programmeSlug}.example`);
  const consultant = await person(`consultant@${programmeSlug}.example`);
  const family = await person(`family@${programmeSlug}.example`);
  if (!coordinator || !consultant) return 0;
  // Babies at home on an approved setting, not the demo family's own (their page stays as it is).
  const babies: Array<{ id: string }> = await ds.query(
    `SELECT i.id FROM infants i JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active' AND p.approved_flow_lpm IS NOT NULL
      WHERE i.programme_id = $1 AND i.status = 'on_oxygen' AND i.nurse_id IS NOT NULL
        AND NOT EXISTS (SELECT 1 FROM family_contacts fc WHERE fc.infant_id = i.id AND fc.user_id = $2)
      ORDER BY i.family_name, i.given_name LIMIT 5`,
    [coordinator.programmeId, family?.id ?? null]);
  if (babies.length < 5) return 0;
  const service = createDischargeService(ds, repos);
  const abilityOf = (u: NonNullable<typeof coordinator>) => defineAbilityFor({ id: u.id, role: u.role, programmeId: u.programmeId } as AbilityUser);
  const actor = (u: NonNullable<typeof coordinator>) => ({ id: u.id, programmeId: u.programmeId, ip: null, timeZone: u.programmeTimeZone });
  const today = localParts(new Date(), coordinator.programmeTimeZone).date;
  const tick = async (infantId: string, keys: readonly string[]) => {
    for (const key of keys) {
      const rule = DEFAULT_DISCHARGE_RULES.items.find((r) => r.key === key)!;
      const evidence = rule.evidence.length ? { date: addDays(today, -2), person: EVIDENCE.person } : undefined;
      await service.updateItem(abilityOf(coordinator), actor(coordinator), infantId, key, {
        done: true, ...(evidence ? { evidence: Object.fromEntries(rule.evidence.map((k) => [k, evidence[k]])) } : {}),
        ...(key === 'cylinder_storage' ? { note: 'Cylinders in the understairs cupboard, away from the boiler' } : {}),
      });
    }
  };
  const [partDone, ready, goingHome, overridden, home] = babies.map((b) => b.id);
  await tick(partDone, ALL.filter((k) => !['home_assessment', 'smoke_alarms', 'community_team_told'].includes(k)));
  await tick(ready, ALL);
  await tick(goingHome, ALL);
  await service.setDate(abilityOf(coordinator), actor(coordinator), goingHome, { date: addDays(today, 3) });
  await tick(overridden, ALL.filter((k) => k !== 'smoke_alarms'));
  await service.setDate(abilityOf(consultant), actor(consultant), overridden, {
    date: addDays(today, 5), overrideReason: 'Family moving to grandparents, who have working alarms; the community nurse checks them on the first visit.',
  });
  await tick(home, ALL);
  await service.setDate(abilityOf(coordinator), actor(coordinator), home, { date: addDays(today, -10) });
  return 5;
}
