import { z } from 'zod';
import { plainText } from './common';

/** At least 12 characters, no composition rules (ASVS 5.0 V6); the server also refuses common passwords. */
export const PASSWORD_MIN_LENGTH = 12;
export const newPasswordSchema = plainText()
  .min(PASSWORD_MIN_LENGTH, { error: `Use at least ${PASSWORD_MIN_LENGTH} characters` })
  .max(256, { error: 'At most 256 characters' });

const token = plainText().min(20, { error: 'This link is not complete' }).max(200, { error: 'This link is not complete' });

export const setupLinkCheckSchema = z.strictObject({ token });
export const setupLinkInfoSchema = z.object({ name: z.string(), email: z.string(), programmeName: z.string() });
export type SetupLinkInfo = z.infer<typeof setupLinkInfoSchema>;

export const setPasswordSchema = z.strictObject({ token, password: newPasswordSchema });
export type SetPasswordInput = z.infer<typeof setPasswordSchema>;
export const setPasswordResponseSchema = z.object({ email: z.string() });

export const changePasswordSchema = z.strictObject({
  currentPassword: plainText().min(1, { error: 'Enter your current password' }).max(256),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

/** The same answer whether or not the address already had an account (no account discovery across programmes). */
export const invitationResponseSchema = z.object({ status: z.literal('invitation_sent'), email: z.string() });
export type InvitationResponse = z.infer<typeof invitationResponseSchema>;
