import type { AppDeps } from '../server/deps';
import { seedPeople } from './seed-people';
import { seedBabies } from './seed-babies';
import { seedMonitoring } from './seed-monitoring';
import { seedVisits } from './seed-visits';
import { seedJourneys } from './seed-journeys';
import { seedPolicies } from './seed-policy';
import { seedHistory } from './seed-history';
import { seedWaiting } from './seed-waiting';
import { seedDischarges } from './seed-discharges';
import { seedEquipmentOrders } from './seed-equipment';

/** The whole demo scenario, in order; `npm run seed` runs it, and tests that need the demo babies call it too. */
export async function seedDemo(deps: AppDeps) {
  const people = await seedPeople(deps);
  await seedPolicies(deps);
  const babies = (await seedBabies(deps, 'larkmoor', 40)) + (await seedBabies(deps, 'saltmarsh', 12));
  const studies = await seedMonitoring(deps, 'larkmoor');
  const visits = await seedVisits(deps, 'larkmoor');
  const journeys = await seedJourneys(deps, 'larkmoor');
  // After the others: the overview's year of history and the work waiting on the start pages.
  const history = await seedHistory(deps, 'larkmoor');
  const waiting = await seedWaiting(deps, 'larkmoor');
  const discharges = await seedDischarges(deps, 'larkmoor');
  const orders = await seedEquipmentOrders(deps, 'larkmoor');
  return { people, babies, studies, visits, journeys, history, waiting, discharges, orders };
}
