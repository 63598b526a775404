import type { FakeMail, FakeMailMessage } from '../../fakes/mail/app';
import { waitFor } from './messaging';

/** The latest e-mail the fake received for an address (waits for it). */
export const mailTo = (mail: FakeMail, to: string, subject?: RegExp): Promise<FakeMailMessage> =>
  waitFor(`an e-mail to ${to}`, async () =>
    [...mail.messages()].reverse().find((m) => m.envelope.to.includes(to) && (!subject || subject.test(m.subject))), 5000);

export const mailsTo = (mail: FakeMail, to: string) => mail.messages().filter((m) => m.envelope.to.includes(to));

export function linkToken(message: FakeMailMessage): string {
  const match = /\/set-password\?token=([A-Za-z0-9_-]+)/.exec(message.text);
  if (!match) throw new Error(`no set-up link in: ${message.text}`);
  return match[1];
}
