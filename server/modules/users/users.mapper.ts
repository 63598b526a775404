import type { User } from '@shared/schemas/users';
import type { UserEntity } from '../../db/entities/user.entity';
import type { UserListRow } from '../../db/repositories/users.repository';

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

export const listRowToUserDto = (r: UserListRow): User => ({
  id: r.id,
  email: r.email,
  name: r.name,
  role: r.role,
  programmeId: r.programme_id,
  disabled: r.disabled,
  passwordSet: r.password_set,
  createdAt: new Date(r.created_at).toISOString(),
  lastSignInAt: r.last_sign_in_at ? new Date(r.last_sign_in_at).toISOString() : null,
});
