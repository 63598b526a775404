import { getCountries, getCountryCallingCode, isSupportedCountry, parsePhoneNumberFromString, type CountryCode, type PhoneNumber } from 'libphonenumber-js/max';

/**
 * Phone numbers, read and written the same way in the browser, the API and the worker (libphonenumber-js with its
 * 'max' metadata, the only one that tells a mobile from a landline). Stored as E.164 ('+447700900123'); a number
 * typed without its country code is read in the programme's country.
 */
export type { CountryCode };
export const DEFAULT_COUNTRY: CountryCode = 'GB';
export const isCountryCode = (code: string): code is CountryCode => /^[A-Z]{2}$/.test(code) && isSupportedCountry(code);

/** 'mobile': texts go to it (a family's number); 'any': people call it (the programme's own numbers, landlines too). */
export type PhoneUse = 'mobile' | 'any';
export type PhoneReading = { ok: true; e164: string } | { ok: false; message: string };

// Ofcom keeps these UK ranges for drama and examples, so they are never anyone's number; the demo and tests use them.
// libphonenumber rightly calls them invalid; here they count as a mobile (07700 900xxx) and a landline (01632 960xxx).
const FICTIONAL_MOBILE = /^\+447700900\d{3}$/;
const FICTIONAL_LANDLINE = /^\+441632960\d{3}$/;

const TEXTABLE = new Set(['MOBILE', 'FIXED_LINE_OR_MOBILE']);

export function readPhone(input: string, country: CountryCode, use: PhoneUse): PhoneReading {
  const text = input.trim();
  if (!/^[+0-9 ().-]+$/.test(text) || !/[0-9]/.test(text)) return { ok: false, message: 'Use digits, spaces and an optional leading +' };
  let parsed: PhoneNumber | undefined;
  try {
    parsed = parsePhoneNumberFromString(text, country);
  } catch {
    parsed = undefined;
  }
  if (!parsed) return { ok: false, message: `This does not read as a phone number; start with + and the country code if it is not a ${country} number` };
  const e164 = parsed.number;
  if (FICTIONAL_MOBILE.test(e164)) return { ok: true, e164 };
  if (FICTIONAL_LANDLINE.test(e164)) return use === 'any' ? { ok: true, e164 } : { ok: false, message: notMobile };
  if (!parsed.isValid()) return { ok: false, message: `This is not a complete phone number; check the digits, and start with + and the country code if it is not a ${country} number` };
  if (use === 'mobile' && !TEXTABLE.has(parsed.getType() ?? '')) return { ok: false, message: notMobile };
  return { ok: true, e164 };
}
const notMobile = 'This number cannot receive text messages (a landline or a service number): enter a mobile number';

/** True for a number already in E.164 form; anything else stored is an old entry that could not be read. */
export const isE164 = (value: string) => /^\+[1-9][0-9]{6,14}$/.test(value);

/**
 * How people read a number: national form for the programme's own country ('07700 900123'), international for
 * any other ('+34 612 34 56 78'). Text that cannot be read is shown as it was stored.
 */
export function formatPhone(value: string, country: CountryCode): string {
  const read = readPhone(value, country, 'any');
  const parsed = read.ok ? parsePhoneNumberFromString(read.e164) : undefined;
  if (!parsed) return value;
  return parsed.country === country || (!parsed.country && parsed.countryCallingCode === getCountryCallingCode(country)) ? parsed.formatNational() : parsed.formatInternational();
}

/** The number to dial from a link (tel:), E.164 where it can be read. */
export function dialable(value: string, country: CountryCode): string {
  try {
    return parsePhoneNumberFromString(value, country)?.number ?? value.replace(/[^0-9+]/g, '');
  } catch {
    return value.replace(/[^0-9+]/g, '');
  }
}

/** Every country the number reader knows, named in English and sorted by name, with its calling code. */
export function countryChoices(): Array<{ code: CountryCode; name: string; callingCode: string }> {
  const names = new Intl.DisplayNames(['en-GB'], { type: 'region' });
  return getCountries()
    .map((code) => ({ code, name: names.of(code) ?? code, callingCode: getCountryCallingCode(code) }))
    .sort((a, b) => a.name.localeCompare(b.name, 'en-GB'));
}
