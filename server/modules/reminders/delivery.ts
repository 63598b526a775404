import type { DataSource, EntityManager } from 'typeorm';
import { chooseChannel } from '@shared/reminders/recipient';
import { inQuietHours, outsideQuietHours } from '@shared/reminders/timing';
import type { Channel, MessageTemplate } from '@shared/schemas/messages';
import type { ReminderRow } from '../../db/repositories/reminders.repository';
import type { AppRepos } from '../../deps';
import type { Logger } from '../../lib/logger';
import { PermanentSendError } from '../../notifications/errors';
import type { MailSearch } from '../../notifications/mail-search';
import type { MailSender } from '../../notifications/mail-sender';
import { renderMessage, type RenderedMessage } from '../../notifications/render';
import type { SmsSender } from '../../notifications/sms-sender';
import { addToFailureAlerts } from './failure-alerts';
import { messageView } from './message-content';

/** Reminders the family gets about their visits and journeys; turning reminders off silences these. */
const FAMILY_REMINDERS = new Set<MessageTemplate>(['visit-day-before', 'visit-morning', 'journey-day-before']);

/**
 * An attempt that started this recently may still be in flight in another worker (a job that looked stalled);
 * until then a second attempt stands back rather than risk sending twice. Must be longer than the senders' time-out.
 */
export const DEFAULT_IN_FLIGHT_GUARD_MS = 30_000;

export type DeliveryOutcome =
  | 'sent' | 'recovered' | 'already-done' | 'not-yet' | 'held-quiet-hours' | 'skipped' | 'failed' | 'in-flight-elsewhere' | 'missing'
  | 'held-outcome-unknown';

export interface DeliveryDeps {
  ds: DataSource;
  repos: AppRepos;
  mail: MailSender;
  sms: SmsSender;
  logger: Logger;
  /**
   * The mail service's message search, to settle an e-mail attempt of unknown outcome. Without one such an e-mail
   * is never sent again automatically: it waits as 'unknown' for a coordinator.
   */
  mailSearch?: MailSearch | null;
  /** Enqueues reminders made while delivering (the coordinators' alerts on a failure). */
  enqueue(rows: Array<{ id: string; send_at: Date }>): Promise<void>;
  inFlightGuardMs?: number;
  /** The time, injected so tests run at fixed instants. */
  clock?: () => Date;
}

interface Claim {
  reminder: ReminderRow;
  channel: Channel;
  address: string;
  message: RenderedMessage;
  /** Set when an earlier attempt began and never reported back: it may or may not have reached the provider. */
  uncertainSince: Date | null;
}

const messageIdFor = (reminderId: string) => `<reminder-${reminderId}@nestflow.invalid>`;

export function createDelivery(deps: DeliveryDeps) {
  const { ds, repos } = deps;
  const clock = deps.clock ?? (() => new Date());

  /** Where and how this message goes now: consent, opt-out and addresses are read at send time, not at booking. */
  async function resolveRecipient(r: ReminderRow, m: EntityManager): Promise<{ channel: Channel; address: string; name: string; language: string; timeZone: string } | { skip: string }> {
    if (r.contact_id) {
      const c = await repos.reminderContent.familyContact(r.contact_id, m);
      if (!c) return { skip: 'no-longer-needed' };
      const choice = chooseChannel(
        { preferredChannel: c.preferred_channel, consentSms: c.consent_sms, consentEmail: c.consent_email, mobile: c.mobile, email: c.email, remindersEnabled: c.reminders_enabled },
        FAMILY_REMINDERS.has(r.template) ? 'reminder' : 'change-note',
      );
      if ('skip' in choice) return { skip: choice.skip };
      return { ...choice, name: c.name, language: c.language, timeZone: c.time_zone };
    }
    if (r.user_id) {
      const u = await repos.reminderContent.staffRecipient(r.user_id, m);
      if (!u || u.disabled) return { skip: 'no-longer-needed' };
      return { channel: 'email', address: u.email, name: u.name, language: 'en', timeZone: r.time_zone };
    }
    return { skip: 'no-longer-needed' };
  }

  /** Step 1, in one short transaction: decide whether this message goes now, render it and mark the attempt. */
  async function claim(id: string, now: Date): Promise<Claim | DeliveryOutcome> {
    return ds.transaction(async (m) => {
      const r = await repos.reminders.lockForDelivery(id, m);
      if (!r) return 'missing';
      if (r.status !== 'scheduled') return 'already-done';
      const ledger = await repos.reminders.delivery(id, m);
      if (ledger?.state === 'sent') {
        await repos.reminders.update(id, { status: 'sent', provider_id: ledger.provider_id, sent_at: now }, m);
        return 'already-done';
      }
      if (new Date(r.send_at).getTime() > now.getTime() + 5_000) return 'not-yet';
      if (ledger?.state === 'sending' && now.getTime() - new Date(ledger.started_at).getTime() < (deps.inFlightGuardMs ?? DEFAULT_IN_FLIGHT_GUARD_MS)) return 'in-flight-elsewhere';

      const skip = async (reason: string) => {
        await repos.reminders.update(id, { status: 'skipped', reason }, m);
        return 'skipped' as const;
      };
      const to = await resolveRecipient(r, m);
      if ('skip' in to) return skip(to.skip);
      const notAfter = r.not_after ? new Date(r.not_after) : null;
      if (notAfter && now.getTime() > notAfter.getTime()) return skip('no-longer-needed');
      const settings = await policyOf(r.programme_id, m);
      // Quiet hours are checked again at send time: a queue that ran late must not wake a family at night. (An
      // attempt of unknown outcome is settled first, whatever the hour: it may already have gone.)
      if (ledger?.state !== 'sending' && inQuietHours(now, to.timeZone, settings.reminders)) {
        const later = outsideQuietHours(now, to.timeZone, settings.reminders);
        if (notAfter && later.getTime() > notAfter.getTime()) return skip('quiet-hours');
        await repos.reminders.update(id, { send_at: later }, m);
        return 'held-quiet-hours';
      }
      const programme = await repos.reminderContent.programmeName(r.programme_id, m);
      const view = await messageView({ reminder: { ...r, recipient_name: to.name }, language: to.language, programmeName: programme.name, settings, now }, repos.reminderContent, m);
      if (!view) return skip('nothing-to-send');
      const message = renderMessage(r.template, to.channel, to.language, view);

      // An earlier attempt to another address (the family changed it meanwhile) cannot have reached this one.
      const uncertainSince = ledger?.state === 'sending' && ledger.channel === to.channel && ledger.to_address === to.address ? new Date(ledger.started_at) : null;
      await repos.reminders.startAttempt(id, to.channel, to.address, m);
      await repos.reminders.update(id, { channel: to.channel, to_address: to.address, recipient_name: to.name, language: message.language, attempts: r.attempts + 1 }, m);
      return { reminder: r, channel: to.channel, address: to.address, message, uncertainSince };
    });
  }

  async function policyOf(programmeId: string, m: EntityManager) {
    return (await repos.policies.current(programmeId, m)).settings;
  }

  async function markSent(id: string, providerId: string) {
    await ds.transaction(async (m) => {
      await repos.reminders.finishAttempt(id, 'sent', providerId, m);
      await repos.reminders.update(id, { status: 'sent', provider_id: providerId, sent_at: clock(), last_error: null }, m);
    });
  }

  /**
   * A family message that finally failed ('failed'), or whose e-mail may or may not have gone and cannot be
   * settled ('unknown', left for a coordinator to decide): marked so, and added to each coordinator's alert for
   * the period (policy: failureAlertPeriodMinutes), so twenty failures make one e-mail per coordinator, not forty.
   */
  async function markForCoordinators(c: Claim, outcome: 'failed' | 'unknown', error: string) {
    const now = clock();
    const alerts = await ds.transaction(async (m) => {
      if (outcome === 'failed') {
        await repos.reminders.finishAttempt(c.reminder.id, 'failed', null, m);
        await repos.reminders.update(c.reminder.id, { status: 'failed', last_error: error }, m);
      } else {
        // The ledger stays 'sending': the attempt's outcome is still not known. Sending again is a person's choice.
        await repos.reminders.update(c.reminder.id, { status: 'unknown', reason: 'outcome-unknown', last_error: error }, m);
      }
      if (!c.reminder.contact_id) return [];
      const infant = c.reminder.infant_id ? await repos.reminderContent.infantGivenName(c.reminder.infant_id, m) : undefined;
      return addToFailureAlerts(repos, m, c.reminder, {
        reminderId: c.reminder.id, outcome, familyName: c.reminder.recipient_name, babyName: infant?.given_name ?? '', template: c.reminder.template,
        channel: c.channel, address: c.address, error, at: now.toISOString(),
      }, await policyOf(c.reminder.programme_id, m), now);
    });
    await deps.enqueue(alerts);
  }

  /**
   * An earlier attempt began and never reported back. SMS: the provider's message list says whether it went.
   * E-mail: the mail service's search by Message-ID; with no search, or none that answers by the last attempt,
   * the message is held for a coordinator rather than sent a second time.
   */
  async function settleUncertain(c: Claim, since: Date, finalAttempt: boolean): Promise<'recovered' | 'send' | 'held-outcome-unknown'> {
    const found = c.channel === 'sms'
      ? await deps.sms.findSent({ to: c.address, body: c.message.text }, since)
      : deps.mailSearch
        ? await deps.mailSearch.findSent(messageIdFor(c.reminder.id), since).catch((err: unknown) => {
          if (finalAttempt) return 'cannot-tell' as const;
          throw err;
        })
        : ('cannot-tell' as const);
    if (found === 'cannot-tell') {
      await markForCoordinators(c, 'unknown', deps.mailSearch ? 'The mail service could not say whether it was accepted' : 'An attempt may have reached the mail service before the worker stopped; no mail search is configured to check');
      return 'held-outcome-unknown';
    }
    if (found) {
      await markSent(c.reminder.id, found.providerId);
      return 'recovered';
    }
    return 'send';
  }

  async function send(c: Claim): Promise<{ providerId: string }> {
    if (c.channel === 'sms') return deps.sms.send({ to: c.address, body: c.message.text });
    return deps.mail.send({ to: c.address, subject: c.message.subject ?? '', text: c.message.text, html: c.message.html ?? undefined, messageId: messageIdFor(c.reminder.id) });
  }

  return {
    /**
     * Delivers one reminder at most once. The ledger row written before the provider is called records that an
     * attempt began; if a worker dies after the provider accepted the message but before "sent" was written, the
     * next attempt finds that row and asks the provider before sending again (SMS: its message list; e-mail: the
     * mail search by Message-ID, or a coordinator when there is none). `finalAttempt` turns a temporary failure
     * into a final one.
     */
    async deliver(id: string, opts: { finalAttempt: boolean; now?: Date }): Promise<DeliveryOutcome> {
      const claimed = await claim(id, opts.now ?? clock());
      if (typeof claimed === 'string') return claimed;
      if (claimed.uncertainSince) {
        const settled = await settleUncertain(claimed, claimed.uncertainSince, opts.finalAttempt);
        if (settled !== 'send') return settled;
      }
      try {
        const { providerId } = await send(claimed);
        await markSent(id, providerId);
        return 'sent';
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        if (err instanceof PermanentSendError || opts.finalAttempt) {
          await markForCoordinators(claimed, 'failed', message);
          return 'failed';
        }
        // A time-out may have reached the provider: the ledger stays 'sending' so the retry checks first.
        const timedOut = /time ?out|timed out|ETIMEDOUT|ESOCKET|ECONNRESET/i.test(message);
        if (!timedOut) await repos.reminders.finishAttempt(id, 'retrying', null);
        await repos.reminders.update(id, { last_error: message });
        throw err;
      }
    },
  };
}
export type Delivery = ReturnType<typeof createDelivery>;
