import type { Channel, SkipReason } from '../schemas/messages';

export interface FamilyContactPrefs {
  preferredChannel: Channel;
  consentSms: boolean;
  consentEmail: boolean;
  mobile: string | null;
  email: string | null;
  remindersEnabled: boolean;
}

/** '+44 7700 900123' → '+447700900123': the form SMS providers expect and inbound replies arrive from. */
export const smsNumber = (mobile: string) => mobile.replace(/[^0-9+]/g, '');

export type ChannelChoice = { channel: Channel; address: string } | { skip: Extract<SkipReason, 'no-consent' | 'opted-out'> };

/**
 * The preferred channel when the family agreed to it and gave an address for it, otherwise the other channel on the
 * same terms; never a channel without consent. Turning reminders off silences reminders only: a note that a visit
 * moved or was cancelled still goes (on a consented channel), since a family acting on an old time is the harm.
 */
export function chooseChannel(c: FamilyContactPrefs, kind: 'reminder' | 'change-note'): ChannelChoice {
  if (kind === 'reminder' && !c.remindersEnabled) return { skip: 'opted-out' };
  const usable = (ch: Channel) => (ch === 'sms' ? (c.consentSms && c.mobile ? smsNumber(c.mobile) : null) : c.consentEmail && c.email ? c.email : null);
  const order: Channel[] = c.preferredChannel === 'sms' ? ['sms', 'email'] : ['email', 'sms'];
  for (const channel of order) {
    const address = usable(channel);
    if (address) return { channel, address };
  }
  return { skip: 'no-consent' };
}
