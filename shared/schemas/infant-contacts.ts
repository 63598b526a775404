// Enrolment and family contacts: the schemas that read phone numbers (see the note in ./infants).
import { z } from 'zod';
import { plainText } from './common';
import { babySchema, homeSettingSchema, hospitalSettingSchema, requiredText } from './infants';
import { optionalPhoneNumber, perCountry } from './phone';

/** A family contact; the mobile is read in the programme's country and must be able to receive texts. */
export const contactSchemaFor = perCountry((country) => z
  .strictObject({
    name: requiredText('name'),
    relation: requiredText('relation', 60),
    mobile: optionalPhoneNumber(country, 'mobile').optional(),
    email: plainText().trim().toLowerCase().pipe(z.email({ error: 'Enter a valid e-mail address' })).optional().or(z.literal('').transform(() => undefined)),
    preferredChannel: z.enum(['sms', 'email'], { error: 'Choose SMS or e-mail' }),
    consentSms: z.boolean(),
    consentEmail: z.boolean(),
    language: plainText().regex(/^[a-z]{2}(-[A-Z]{2})?$/, { error: 'Use a language code such as en or cy' }).default('en'),
    timeZone: plainText().min(1).max(60).refine((tz) => { try { new Intl.DateTimeFormat('en', { timeZone: tz }); return true; } catch { return false; } }, { error: 'Unknown time zone' }),
  })
  .superRefine((c, ctx) => {
    if (c.preferredChannel === 'sms' && !c.mobile) ctx.addIssue({ code: 'custom', path: ['mobile'], message: 'SMS is preferred: enter a mobile number' });
    if (c.preferredChannel === 'email' && !c.email) ctx.addIssue({ code: 'custom', path: ['email'], message: 'E-mail is preferred: enter an e-mail address' });
    if (c.consentSms && !c.mobile) ctx.addIssue({ code: 'custom', path: ['mobile'], message: 'SMS consent needs a mobile number' });
    if (c.consentEmail && !c.email) ctx.addIssue({ code: 'custom', path: ['email'], message: 'E-mail consent needs an e-mail address' });
  }));
export type ContactInput = z.infer<ReturnType<typeof contactSchemaFor>>;
const contactListFor = perCountry((country) =>
  z.array(contactSchemaFor(country)).min(1, { error: 'Add at least one family contact' }).max(4, { error: 'At most 4 contacts' }));

export const enrolInfantSchemaFor = perCountry((country) => z.strictObject({
  /** Made by the form once; a repeated submit with the same key returns the same baby. */
  enrolKey: z.uuid(),
  baby: babySchema,
  hospital: hospitalSettingSchema,
  home: homeSettingSchema,
  care: z.strictObject({ nurseId: z.uuid({ error: 'Choose the home-care nurse' }), consultantId: z.uuid({ error: 'Choose the consultant' }) }),
  contacts: contactListFor(country),
}));
export type EnrolInfantInput = z.infer<ReturnType<typeof enrolInfantSchemaFor>>;
export type EnrolInfantFormValues = z.input<ReturnType<typeof enrolInfantSchemaFor>>;

export const replaceContactsSchemaFor = perCountry((country) => z.strictObject({ contacts: contactListFor(country) }));
