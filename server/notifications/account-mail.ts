import type { Logger } from '../lib/logger';
import type { MailSender } from './mail-sender';

// Account e-mails are sent by the API itself, not queued as reminders: a set-up link must never be stored in
// readable form, and the row that queued it would be exactly that.

// Control characters (CR/LF included) become spaces, so no value can start a new line or header.
const plain = (value: string) => value.replace(/[\p{Cc}\u2028\u2029]+/gu, ' ');

export interface AccountMailContext {
  to: string;
  name: string;
  programmeName: string;
}

export interface AccountMail {
  invitation(ctx: AccountMailContext & { link: string; expiresAt: Date; invitedBy: string }): Promise<void>;
  newSetupLink(ctx: AccountMailContext & { link: string; expiresAt: Date }): Promise<void>;
  alreadyHasAccount(ctx: AccountMailContext): Promise<void>;
  signInAttempts(ctx: AccountMailContext & { failures: number }): Promise<void>;
}

const when = (d: Date) => d.toUTCString().replace(' GMT', ' UTC');

export function createAccountMail(sender: MailSender): AccountMail {
  const send = async (to: string, subject: string, lines: string[]) => {
    await sender.send({ to, subject: plain(subject), text: `${lines.join('\n')}\n\n— Nestflow\n` });
  };
  return {
    invitation: ({ to, name, programmeName, link, expiresAt, invitedBy }) =>
      send(to, `Set up your Nestflow account for ${programmeName}`, [
        `Hello ${plain(name)},`,
        '',
        `${plain(invitedBy)} has added you to ${plain(programmeName)} on Nestflow.`,
        'Choose your own password with this link (it works once):',
        '',
        link,
        '',
        `The link stops working at ${when(expiresAt)}. If it has, ask your programme admin for a new one.`,
        'If you were not expecting this, you can ignore this e-mail.',
      ]),
    newSetupLink: ({ to, name, programmeName, link, expiresAt }) =>
      send(to, 'A new set-up link for your Nestflow account', [
        `Hello ${plain(name)},`,
        '',
        `Your programme admin at ${plain(programmeName)} has sent you a new set-up link. Your old password no longer`,
        'works and every place you were signed in has been signed out. Choose a new password here (the link works once):',
        '',
        link,
        '',
        `The link stops working at ${when(expiresAt)}.`,
      ]),
    alreadyHasAccount: ({ to, name, programmeName }) =>
      send(to, 'Someone tried to add your e-mail address to Nestflow', [
        `Hello ${plain(name)},`,
        '',
        'A programme admin tried to add this e-mail address to Nestflow, but it already has an account',
        `(with ${plain(programmeName)}). Nothing has changed: your account and password are as they were.`,
        'If you expected to be added, reply to the person who asked, or use another e-mail address with them.',
      ]),
    signInAttempts: ({ to, name, failures }) =>
      send(to, 'Someone has been trying to sign in to your Nestflow account', [
        `Hello ${plain(name)},`,
        '',
        `There have been ${failures} failed attempts to sign in to your Nestflow account recently.`,
        'Attempts from the places they came from are now being refused; you can still sign in as usual.',
        'If this was you, there is nothing to do. If not, sign in and use "Change my password" at the top of the page,',
        'and tell your programme admin.',
      ]),
  };
}

/** For notices nobody waits on (an attack alert): a failed send is logged, never an error for the request. */
export const quietly = (logger: Logger, what: string) => (e: unknown) => logger.warn(`${what} not sent`, { err: (e as Error)?.message });
