import { defineAbilityFor, type AbilityUser } from '@shared/auth/ability';
import { addDays } from '@shared/clinical/dates';
import { localParts } from '@shared/reminders/timing';
import type { AppDeps } from '../server/deps';
import { createJourneysService } from '../server/modules/journeys/journeys.service';
import { demoPerson } from './seed-people';

/**
 * Demo journey checks through the journeys service: the demo family's approved road trip to the hills later this
 * week (it shows on their page and plans a reminder the day before), and a flight waiting for the consultant.
 */
export async function seedJourneys(deps: AppDeps, programmeSlug: string): Promise<number> {
  const { ds, repos } = deps;
  const already = await ds.query(`SELECT 1 FROM journeys j JOIN programmes p ON p.id = j.programme_id WHERE p.slug = $1 LIMIT 1`, [programmeSlug]);
  if (already.length) return 0;
  const person = (email: string) => demoPerson(deps, email);
  const family = await person(`family@${programmeSlug}.example`);
  const coordinator = await person(`coordinator@${programmeSlug}.example`);
  const consultant = await person(`consultant@${programmeSlug}.example`);
  if (!family || !coordinator || !consultant) return 0;
  const [own] = await ds.query(
    `SELECT fc.infant_id FROM family_contacts fc JOIN prescriptions p ON p.infant_id = fc.infant_id AND p.status = 'active' WHERE fc.user_id = $1 LIMIT 1`, [family.id]);
  const [other] = await ds.query(
    `SELECT i.id FROM infants i JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'
      WHERE i.programme_id = $1 AND i.status = 'on_oxygen' AND ($2::uuid IS NULL OR i.id <> $2) ORDER BY i.family_name DESC LIMIT 1`,
    [coordinator.programmeId, own?.infant_id ?? null]);
  const service = createJourneysService(ds, repos);
  const asActor = (u: NonNullable<typeof family>) => ({ id: u.id, programmeId: u.programmeId, ip: null, role: u.role, timeZone: u.programmeTimeZone });
  const abilityOf = (u: NonNullable<typeof family>, infantIds: string[] = []) =>
    defineAbilityFor({ id: u.id, role: u.role, programmeId: u.programmeId, infantIds } as AbilityUser);
  const today = localParts(new Date(), coordinator.programmeTimeZone).date;
  let n = 0;
  if (own) {
    const trip = await service.create(abilityOf(family, [own.infant_id]), asActor(family), own.infant_id, {
      mode: 'road', destinationName: 'Grandparents at Highfold Top', destinationElevationM: 620, departOn: addDays(today, 4), returnOn: addDays(today, 7),
      hoursAway: 3, notes: 'Three hours in the car each way; a concentrator is there for the nights.',
    }, 'family');
    await service.decide(abilityOf(consultant), asActor(consultant), trip.id, { decision: 'approve', rowVersion: trip.rowVersion });
    n++;
  }
  if (other) {
    await service.create(abilityOf(coordinator), asActor(coordinator), other.id, {
      mode: 'flight', destinationName: 'Family visit overseas', cabinAltitudeFt: null, departOn: addDays(today, 12), returnOn: addDays(today, 26),
      hoursAway: 9, notes: 'Seven-hour flight plus the journeys to and from the airports.',
    }, 'staff');
    n++;
  }
  return n;
}
