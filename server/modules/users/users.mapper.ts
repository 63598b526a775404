import type { User } from '@shared/schemas/users';
import type { UserEntity } from '../../db/entities/user.entity';

export const toUserDto = (u: UserEntity): User => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  programmeId: u.programmeId,
  disabled: u.disabled,
  passwordSet: u.passwordHash !== null,
  createdAt: u.createdAt.toISOString(),
  lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
});
