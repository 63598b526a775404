import { z } from 'zod';
import { ROLES } from '../auth/roles';
import { cursorPagedSchema, cursorQueryShape, pageQuerySchema, plainText } from './common';

export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  programmeId: z.uuid(),
  disabled: z.boolean(),
  /** False until the person has chosen a password from their set-up link. */
  passwordSet: z.boolean(),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type User = z.infer<typeof userSchema>;

export const USER_SORTS = ['name', '-name', 'email', '-email', 'role', '-role', 'createdAt', '-createdAt'] as const;

export const listUsersQuerySchema = pageQuerySchema.extend({
  sort: z.enum(USER_SORTS, { error: 'Unknown sort' }).default('name'),
  role: z.enum(ROLES, { error: 'Unknown role' }).optional(),
  q: plainText().trim().max(100).optional(),
  ...cursorQueryShape,
});
export type ListUsersQuery = z.infer<typeof listUsersQuerySchema>;

export const usersPageSchema = cursorPagedSchema(userSchema);
export type UsersPage = z.infer<typeof usersPageSchema>;

export const createUserSchema = z.strictObject({
  email: plainText().trim().toLowerCase().pipe(z.email({ error: 'Enter a valid e-mail address' })),
  name: plainText().trim().min(2, { error: 'Enter the full name' }).max(120, { error: 'At most 120 characters' }),
  role: z.enum(ROLES, { error: 'Choose a role' }),
});
export type CreateUserInput = z.infer<typeof createUserSchema>;


export const userResponseSchema = z.object({ user: userSchema });
export type UserResponse = z.infer<typeof userResponseSchema>;
