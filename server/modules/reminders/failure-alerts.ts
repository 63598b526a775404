import type { EntityManager } from 'typeorm';
import type { Channel, MessageTemplate } from '@shared/schemas/messages';
import type { PolicySettings } from '@shared/schemas/policy';
import type { AppRepos } from '../../deps';

/** One family message a coordinator must look at: it failed, or whether it went is unknown. */
export interface FailureItem {
  reminderId: string;
  outcome: 'failed' | 'unknown';
  familyName: string;
  babyName: string;
  template: MessageTemplate;
  channel: Channel;
  address: string;
  error: string;
  at: string;
}

/** The period a moment falls in: periods are aligned to the epoch, so every process agrees on them. */
export function alertPeriod(now: Date, minutes: number, ahead = 0): { index: number; endsAt: Date } {
  const ms = minutes * 60_000;
  const index = Math.floor(now.getTime() / ms) + ahead;
  return { index, endsAt: new Date((index + 1) * ms) };
}

/**
 * Adds the item to each coordinator's alert for the current period (one e-mail per coordinator per period, sent
 * when the period ends, listing every item). An alert already being sent is closed: the item goes into the next
 * period's alert instead, so nothing is lost and nothing is listed twice. Returns the alert rows to enqueue.
 */
export async function addToFailureAlerts(
  repos: Pick<AppRepos, 'reminders' | 'reminderContent'>,
  m: EntityManager,
  r: { programme_id: string; infant_id: string | null },
  item: FailureItem,
  settings: PolicySettings,
  now: Date,
): Promise<Array<{ id: string; send_at: Date }>> {
  const coordinators = await repos.reminderContent.activeCoordinators(r.programme_id, m);
  const programme = await repos.reminderContent.programmeTimeZone(r.programme_id, m);
  const rows: Array<{ id: string; send_at: Date }> = [];
  for (const u of coordinators) {
    for (let ahead = 0; ahead < 3; ahead += 1) {
      const period = alertPeriod(now, settings.reminders.failureAlertPeriodMinutes, ahead);
      const row = await repos.reminders.appendToAlert({
        programmeId: r.programme_id, userId: u.id, name: u.name, email: u.email, timeZone: programme.time_zone, item,
        dedupeKey: `delivery-failed-${r.programme_id}-${u.id}-${period.index}`, sendAt: period.endsAt,
      }, m);
      if (row) {
        rows.push(row);
        break;
      }
    }
  }
  return rows;
}
