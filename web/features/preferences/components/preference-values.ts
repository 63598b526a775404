import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldErrors, Resolver } from 'react-hook-form';
import { formatPhone, isCountryCode } from '@shared/phone/phone';
import {
  MESSAGE_LANGUAGES,
  updatePreferencesSchemaFor,
  type Preferences,
  type UpdatePreferencesInput,
} from '@shared/schemas/preferences';

/** The form's shape: the contract's own names (so a 400's details land on the right field), with empty boxes as ''. */
export type PreferencesFormValues = Omit<UpdatePreferencesInput, 'mobile' | 'email'> & { mobile: string; email: string };

export const PREFERENCE_FIELDS = [
  'mobile',
  'email',
  'preferredChannel',
  'consentSms',
  'consentEmail',
  'language',
  'remindersEnabled',
] as const satisfies readonly (keyof PreferencesFormValues)[];

export const CHANNEL_WORDS = { sms: 'Text message', email: 'E-mail' } as const;

export function toFormValues(preferences: Preferences): PreferencesFormValues {
  return {
    rowVersion: preferences.rowVersion,
    mobile: preferences.mobile ? formatPhone(preferences.mobile, isCountryCode(preferences.country) ? preferences.country : 'GB') : '',
    email: preferences.email ?? '',
    preferredChannel: preferences.preferredChannel,
    consentSms: preferences.consentSms,
    consentEmail: preferences.consentEmail,
    language: preferences.language,
    remindersEnabled: preferences.remindersEnabled,
  };
}

/** An emptied box means "I have none", which the contract spells null. */
const blankToNull = (text: string) => (text.trim() === '' ? null : text);

/**
 * Validates with the server's own schema for the programme's country, so "text messages need a mobile number" and
 * "this number cannot receive texts" are caught before sending.
 */
export const preferencesResolver = (country: string): Resolver<PreferencesFormValues, unknown, UpdatePreferencesInput> => async (values, context, options) => {
  const shared = zodResolver(updatePreferencesSchemaFor(country));
  const candidate = { ...values, mobile: blankToNull(values.mobile), email: blankToNull(values.email) };
  const result = await shared(candidate, context, options as never);
  if (Object.keys(result.errors).length === 0) return { values: result.values as UpdatePreferencesInput, errors: {} };
  return { values: {}, errors: result.errors as FieldErrors<PreferencesFormValues> };
};

/** The languages we have messages in, plus the stored one if it is another, so saving never changes it silently. */
export function languageOptions(current: string): { code: string; label: string }[] {
  const known: { code: string; label: string }[] = MESSAGE_LANGUAGES.map(({ code, label }) => ({ code, label }));
  return known.some((option) => option.code === current) ? known : [...known, { code: current, label: `${current} (messages in English)` }];
}

export const languageLabel = (code: string) => MESSAGE_LANGUAGES.find((option) => option.code === code)?.label ?? code;
