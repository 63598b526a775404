import { useAbility } from '@casl/react';
import { defineAbilityFor, type AppAbility } from '@shared/auth/ability';
import type { SessionUser } from '@shared/schemas/session';

/** The web only uses the ability to hide what a person cannot do; the API enforces the same rules. */
export function abilityForSessionUser(user: SessionUser | null): AppAbility {
  return defineAbilityFor(user ? { id: user.id, role: user.role, programmeId: user.programmeId } : null);
}

export const useAppAbility = (): AppAbility => useAbility<AppAbility>();
