import { z } from 'zod';
import { DEFAULT_COUNTRY, isCountryCode, readPhone, type CountryCode, type PhoneUse } from '../phone/phone';
import { plainText } from './common';

/**
 * A phone number as typed ('07700 900123', '+44 7700 900123'), read in the programme's country and given back in
 * E.164. Schemas that hold one are made per country (memoised): the server picks the caller's programme's, the
 * forms the signed-in person's, so both give the same answer.
 */
export const phoneNumber = (country: CountryCode, use: PhoneUse) =>
  plainText().trim().max(40, { error: 'At most 40 characters' }).transform((text, ctx) => {
    const r = readPhone(text, country, use);
    if (r.ok) return r.e164;
    ctx.addIssue({ code: 'custom', message: r.message });
    return z.NEVER;
  });

/** The same, where an empty field means "no number" (undefined). */
export const optionalPhoneNumber = (country: CountryCode, use: PhoneUse) =>
  plainText().trim().max(40, { error: 'At most 40 characters' }).transform((text, ctx) => {
    if (text === '') return undefined;
    const r = readPhone(text, country, use);
    if (r.ok) return r.e164;
    ctx.addIssue({ code: 'custom', message: r.message });
    return z.NEVER;
  });

/** ISO 3166 country code: national numbers are read, and shown, as this country's. */
export const countryCodeSchema = plainText().refine((c) => isCountryCode(c), { error: 'Use a two-letter country code such as GB' })
  .transform((c) => c as CountryCode);

/** One schema per country, made once. */
export function perCountry<T>(make: (country: CountryCode) => T): (country?: string) => T {
  const made = new Map<CountryCode, T>();
  return (country) => {
    const c: CountryCode = country && isCountryCode(country) ? country : DEFAULT_COUNTRY;
    let s = made.get(c);
    if (!s) made.set(c, (s = make(c)));
    return s;
  };
}
