import { z } from 'zod';
import { plainText } from './common';
import { ROLES } from '../auth/roles';

export const sessionUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  programmeId: z.uuid(),
  programmeName: z.string(),
  programmeTimeZone: z.string(),
  /** ISO 3166 code from the programme's policy: how numbers without a country code are read and shown. */
  programmeCountry: z.string(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const sessionResponseSchema = z.object({
  user: sessionUserSchema.nullable(),
  csrfToken: z.string(),
});
export type SessionResponse = z.infer<typeof sessionResponseSchema>;

export const signInSchema = z.strictObject({
  email: plainText().trim().toLowerCase().pipe(z.email({ error: 'Enter an e-mail address' })),
  password: plainText().min(1, { error: 'Enter your password' }).max(256),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signInResponseSchema = z.object({ user: sessionUserSchema, csrfToken: z.string() });
