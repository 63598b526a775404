import { z } from 'zod';
import { plainText } from './common';

/** Languages with message templates in the repository; others fall back to English. */
export const MESSAGE_LANGUAGES = [
  { code: 'en', label: 'English' },
  { code: 'es', label: 'Español' },
] as const;

const mobile = plainText().trim().regex(/^\+?[0-9 ()-]{7,20}$/, { error: 'Enter a mobile number, e.g. +44 7700 900123' });
const email = plainText().trim().toLowerCase().pipe(z.email({ error: 'Enter a valid e-mail address' }));

/** What a family member may change about themselves (audited; the programme sees every change). */
export const updatePreferencesSchema = z
  .strictObject({
    rowVersion: z.number().int().positive(),
    mobile: mobile.nullable(),
    email: email.nullable(),
    preferredChannel: z.enum(['sms', 'email'], { error: 'Choose SMS or e-mail' }),
    consentSms: z.boolean(),
    consentEmail: z.boolean(),
    language: plainText().regex(/^[a-z]{2}(-[A-Z]{2})?$/, { error: 'Choose a language' }),
    remindersEnabled: z.boolean(),
  })
  .superRefine((c, ctx) => {
    if (c.preferredChannel === 'sms' && !c.mobile) ctx.addIssue({ code: 'custom', path: ['mobile'], message: 'Text messages need a mobile number' });
    if (c.preferredChannel === 'email' && !c.email) ctx.addIssue({ code: 'custom', path: ['email'], message: 'E-mail needs an e-mail address' });
    if (c.consentSms && !c.mobile) ctx.addIssue({ code: 'custom', path: ['mobile'], message: 'Agreeing to text messages needs a mobile number' });
    if (c.consentEmail && !c.email) ctx.addIssue({ code: 'custom', path: ['email'], message: 'Agreeing to e-mail needs an e-mail address' });
  });
export type UpdatePreferencesInput = z.infer<typeof updatePreferencesSchema>;

export const preferencesSchema = z.object({
  contactId: z.uuid(),
  name: z.string(),
  relation: z.string(),
  mobile: z.string().nullable(),
  email: z.string().nullable(),
  preferredChannel: z.enum(['sms', 'email']),
  consentSms: z.boolean(),
  consentEmail: z.boolean(),
  language: z.string(),
  remindersEnabled: z.boolean(),
  timeZone: z.string(),
  rowVersion: z.number().int(),
});
export type Preferences = z.infer<typeof preferencesSchema>;
export const preferencesResponseSchema = z.object({ preferences: preferencesSchema });
