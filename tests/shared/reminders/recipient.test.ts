import { describe, expect, it } from 'vitest';
import { chooseChannel, smsNumber, type FamilyContactPrefs } from '@shared/reminders/recipient';

// Consent rules are product rules (docs/product-rules.md "Messages": consent is respected; the family may turn reminders off).
const contact = (over: Partial<FamilyContactPrefs> = {}): FamilyContactPrefs => ({
  preferredChannel: 'sms', consentSms: true, consentEmail: true, mobile: '+44 7700 900123', email: 'parent@test.example', remindersEnabled: true, ...over,
});

describe('which channel a family message goes by', () => {
  it('when SMS is preferred and agreed, then it goes by SMS to the number without spaces', () => {
    expect(chooseChannel(contact(), 'reminder')).toEqual({ channel: 'sms', address: '+447700900123' });
  });

  it('when e-mail is preferred and agreed, then it goes by e-mail', () => {
    expect(chooseChannel(contact({ preferredChannel: 'email' }), 'reminder')).toEqual({ channel: 'email', address: 'parent@test.example' });
  });

  it('when SMS is preferred but not agreed, then it never goes by SMS: e-mail is used if agreed', () => {
    expect(chooseChannel(contact({ consentSms: false }), 'reminder')).toEqual({ channel: 'email', address: 'parent@test.example' });
    expect(chooseChannel(contact({ consentSms: false }), 'change-note')).toEqual({ channel: 'email', address: 'parent@test.example' });
  });

  it('when e-mail is preferred but not agreed, then the agreed SMS is used', () => {
    expect(chooseChannel(contact({ preferredChannel: 'email', consentEmail: false }), 'reminder')).toEqual({ channel: 'sms', address: '+447700900123' });
  });

  it('when the preferred channel has no address, then the other agreed channel is used', () => {
    expect(chooseChannel(contact({ mobile: null }), 'reminder')).toEqual({ channel: 'email', address: 'parent@test.example' });
    expect(chooseChannel(contact({ preferredChannel: 'email', email: null }), 'reminder')).toEqual({ channel: 'sms', address: '+447700900123' });
  });

  it('when SMS is agreed only for a contact without a mobile and e-mail is not agreed, then nothing goes: no-consent', () => {
    expect(chooseChannel(contact({ mobile: null, consentEmail: false }), 'reminder')).toEqual({ skip: 'no-consent' });
  });

  it('when neither channel is agreed, then the message is skipped as no-consent, for reminders and change notes alike', () => {
    const none = contact({ consentSms: false, consentEmail: false });
    expect(chooseChannel(none, 'reminder')).toEqual({ skip: 'no-consent' });
    expect(chooseChannel(none, 'change-note')).toEqual({ skip: 'no-consent' });
  });

  it('when the family turned reminders off, then reminders are skipped as opted-out but a moved or cancelled visit is still told', () => {
    const off = contact({ remindersEnabled: false });
    expect(chooseChannel(off, 'reminder')).toEqual({ skip: 'opted-out' });
    expect(chooseChannel(off, 'change-note')).toEqual({ channel: 'sms', address: '+447700900123' });
  });

  it('when reminders are off and no channel is agreed, then a change note is skipped as no-consent, not sent', () => {
    expect(chooseChannel(contact({ remindersEnabled: false, consentSms: false, consentEmail: false }), 'change-note')).toEqual({ skip: 'no-consent' });
  });
});

describe('mobile numbers as the SMS provider gets them (E.164, common practice)', () => {
  it('when a number is stored with spaces, brackets or dashes, then only the digits and the leading + remain', () => {
    expect(smsNumber('+44 7700 900123')).toBe('+447700900123');
    expect(smsNumber('+1 (303) 555-0142')).toBe('+13035550142');
    expect(smsNumber('  +64 21-555 0199 ')).toBe('+64215550199');
    expect(smsNumber('+447700900123')).toBe('+447700900123');
  });
});
