import { randomUUID } from 'node:crypto';
import type { Role } from '@shared/auth/roles';
import type { AppDeps } from '../../server/deps';
import { hashPassword } from '../../server/auth/passwords';

export const TEST_PASSWORD = 'correct horse battery staple';
let cachedHash: Promise<string> | undefined;
const passwordHash = () => (cachedHash ??= hashPassword(TEST_PASSWORD));

export async function makeProgramme(deps: AppDeps, name = 'Test programme') {
  const slug = `p-${randomUUID().slice(0, 12)}`;
  return deps.repos.programmes.insert({ slug, name: `${name} ${slug}`, timeZone: 'Europe/London' });
}

export async function makeUser(deps: AppDeps, programmeId: string, role: Role, extra: { disabled?: boolean } = {}) {
  return deps.repos.users.insert({
    programmeId,
    role,
    email: `${role}-${randomUUID().slice(0, 12)}@test.example`,
    name: `Test ${role} ${randomUUID().slice(0, 4)}`,
    passwordHash: await passwordHash(),
    disabled: extra.disabled ?? false,
  });
}

/** One programme with one person in every role. */
export async function makeProgrammeWithStaff(deps: AppDeps) {
  const programme = await makeProgramme(deps);
  const roles: Role[] = ['admin', 'coordinator', 'nurse', 'consultant', 'family'];
  const people = Object.fromEntries(await Promise.all(roles.map(async (r) => [r, await makeUser(deps, programme.id, r)] as const)));
  return { programme, people: people as Record<Role, Awaited<ReturnType<typeof makeUser>>> };
}
