import { describe, expect, it } from 'vitest';
import { formatPhone, isE164, readPhone } from '@shared/phone/phone';
import { updatePreferencesSchemaFor } from '@shared/schemas/preferences';
import { updatePolicySchema, DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';

// Number plans: ITU-T E.164 for the stored form; the UK plan (Ofcom) for 07 mobiles, 01/02 landlines and 0800
// freephone; Ofcom keeps 07700 900xxx and 01632 960xxx for drama, so they are nobody's number (from memory).
describe('reading a phone number in the programme\'s country', () => {
  it('when a UK mobile is typed in national form, with spaces or with +44, then each is the same E.164 number', () => {
    for (const typed of ['07700 900111', '07700900111', '+44 7700 900111', '+447700900111', '(07700) 900-111'])
      expect(readPhone(typed, 'GB', 'mobile')).toEqual({ ok: true, e164: '+447700900111' });
  });

  it('when a real-format UK mobile (07911 …) is typed, then it is read as a mobile', () => {
    expect(readPhone('07911 123456', 'GB', 'mobile')).toEqual({ ok: true, e164: '+447911123456' });
  });

  it('when a landline or a freephone number must take texts, then it is refused with a clear message; as a number to call it is kept', () => {
    for (const [typed, e164] of [['020 7946 0123', '+442079460123'], ['01632 960123', '+441632960123'], ['0800 123 4567', '+448001234567']]) {
      expect(readPhone(typed, 'GB', 'mobile')).toEqual({ ok: false, message: 'This number cannot receive text messages (a landline or a service number): enter a mobile number' });
      expect(readPhone(typed, 'GB', 'any')).toEqual({ ok: true, e164 });
    }
  });

  it('when the number is short, has letters or belongs to no plan, then it is refused', () => {
    expect(readPhone('07700 90', 'GB', 'any').ok).toBe(false);
    expect(readPhone('999', 'GB', 'any').ok).toBe(false);
    expect(readPhone('07700 9OO111', 'GB', 'mobile')).toEqual({ ok: false, message: 'Use digits, spaces and an optional leading +' });
    // Ofcom's drama block ends at 900999; the next one is not reserved, and not a valid UK mobile either.
    expect(readPhone('+44 7700 901000', 'GB', 'mobile').ok).toBe(false);
  });

  it('when the programme is elsewhere, then a national number is read in that country', () => {
    // A Spanish mobile starts 6 (Spain's national plan, from memory); the same digits in the UK are no number.
    expect(readPhone('612 345 678', 'ES', 'mobile')).toEqual({ ok: true, e164: '+34612345678' });
    expect(readPhone('612 345 678', 'GB', 'mobile').ok).toBe(false);
  });

  it('when a number is shown, then the programme\'s own are national and others international; unreadable text stays as stored', () => {
    expect(formatPhone('+447700900123', 'GB')).toBe('07700 900123');
    expect(formatPhone('+442079460123', 'GB')).toBe('020 7946 0123');
    expect(formatPhone('+34612345678', 'GB')).toBe('+34 612 34 56 78');
    expect(formatPhone('7700-900', 'GB')).toBe('7700-900');
  });

  it('when a value is checked for E.164, then only + and 7–15 digits without a leading 0 pass', () => {
    expect(isE164('+447700900123')).toBe(true);
    expect(isE164('07700900123')).toBe(false);
    expect(isE164('+44 7700 900123')).toBe(false);
  });
});

describe('the shared contracts use the reader', () => {
  it("when the family's form is checked for GB, then a national number comes out in E.164 and a landline is refused on the mobile field", () => {
    const base = { rowVersion: 1, email: null, preferredChannel: 'sms', consentSms: true, consentEmail: false, language: 'en', remindersEnabled: true };
    expect(updatePreferencesSchemaFor('GB').parse({ ...base, mobile: '07700 900123' }).mobile).toBe('+447700900123');
    const r = updatePreferencesSchemaFor('GB').safeParse({ ...base, mobile: '020 7946 0123' });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join('.'))).toEqual(['mobile']);
  });

  it("when the programme's numbers are saved, then landlines are accepted in E.164 and an unreadable one names its row", () => {
    const settings = (number: string) => ({ ...DEFAULT_POLICY_SETTINGS, contacts: { phones: [{ label: 'Nurses', number, when: '' }], emergencyNumber: '999' } });
    expect(updatePolicySchema.parse({ baseVersion: 0, settings: settings('01632 960 214') }).settings.contacts.phones[0].number).toBe('+441632960214');
    const bad = updatePolicySchema.safeParse({ baseVersion: 0, settings: settings('12') });
    expect(bad.error?.issues.map((i) => i.path.join('.'))).toEqual(['settings.contacts.phones.0.number']);
    const country = updatePolicySchema.safeParse({ baseVersion: 0, settings: { ...settings('01632 960 214'), country: 'XX' } });
    expect(country.error?.issues[0].message).toBe('Use a two-letter country code such as GB');
  });
});
