import type { AppDeps } from '../server/deps';
import { hashPassword } from '../server/auth/passwords';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_PROGRAMMES } from './demo-people';

/** Idempotent: looks each programme and person up by its natural key and only adds what is missing. */
export async function seedPeople(deps: AppDeps): Promise<{ programmes: number; people: number }> {
  const { programmes, users, audit } = deps.repos;
  const ids = new Map<string, string>();
  let addedProgrammes = 0;
  let addedPeople = 0;
  for (const p of DEMO_PROGRAMMES) {
    let row = await programmes.findBySlug(p.slug);
    if (!row) {
      row = await programmes.insert({ slug: p.slug, name: p.name, timeZone: p.timeZone });
      addedProgrammes++;
    }
    ids.set(p.slug, row.id);
  }
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const person of DEMO_PEOPLE) {
    if (await users.findByEmail(person.email)) continue;
    const programmeId = ids.get(person.programme)!;
    await deps.ds.transaction(async (m) => {
      const user = await users.insert({ email: person.email, name: person.name, role: person.role, programmeId, passwordHash }, m);
      await audit.append({ programmeId, actorId: null, action: 'user.created', entityType: 'user', entityId: user.id, details: { role: person.role, by: 'demo-seed' } }, m);
    });
    addedPeople++;
  }
  return { programmes: addedProgrammes, people: addedPeople };
}

/** A demo person with their programme, as a signed-in session would carry them (null until seedPeople has run). */
export async function demoPerson({ repos }: AppDeps, email: string) {
  const user = await repos.users.findByEmail(email);
  return user ? repos.users.findSessionUser(user.id) : null;
}
