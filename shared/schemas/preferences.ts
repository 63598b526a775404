import { z } from 'zod';
import { plainText } from './common';
import { perCountry, phoneNumber } from './phone';

/** Languages with message templates in the repository; others fall back to English. */
export const MESSAGE_LANGUAGES = [
  { code: 'en', label: 'English' },
  { code: 'es', label: 'Español' },
] as const;

const email = plainText().trim().toLowerCase().pipe(z.email({ error: 'Enter a valid e-mail address' }));

/**
 * What a family member may change about themselves (audited; the programme sees every change). The mobile is read
 * in the programme's country and must be able to receive texts.
 */
export const updatePreferencesSchemaFor = perCountry((country) => z
  .strictObject({
    rowVersion: z.number().int().positive(),
    mobile: phoneNumber(country, 'mobile').nullable(),
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
  }));
export type UpdatePreferencesInput = z.infer<ReturnType<typeof updatePreferencesSchemaFor>>;
export type UpdatePreferencesFormValues = z.input<ReturnType<typeof updatePreferencesSchemaFor>>;

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
  /** The programme's country: a number typed without a country code is read as one of its numbers. */
  country: z.string(),
  rowVersion: z.number().int(),
});
export type Preferences = z.infer<typeof preferencesSchema>;
export const preferencesResponseSchema = z.object({ preferences: preferencesSchema });
