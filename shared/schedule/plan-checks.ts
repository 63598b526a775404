import { TZDate } from '@date-fns/tz';
import type { CheckKind } from '../schemas/schedule';
import type { PolicySettings } from '../schemas/policy';

export interface PlanState {
  /** When the first home plan was approved: the baby's first day at home on oxygen. Null = not home yet. */
  homeStartAt: Date | null;
  status: string;
  active: { version: number; approvedAt: Date; reason: string; flowLpm: number } | null;
  offOxygenSince: Date | null;
}

export interface PlannedCheck {
  planKey: string;
  kind: CheckKind;
  dueAt: Date;
  /** The local calendar day the check belongs to, in the programme's time zone. */
  dueDate: string;
}

const DAY_MS = 86_400_000;

/** The local calendar date of an instant in a time zone, as YYYY-MM-DD. */
export function localDate(at: Date, timeZone: string): string {
  const d = new TZDate(at.getTime(), timeZone);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/** The end of a local day (23:59 in the zone), `days` days after the local day of `from`: DST-safe. */
export function endOfLocalDay(from: Date, days: number, timeZone: string): Date {
  const start = new TZDate(from.getTime(), timeZone);
  const d = new TZDate(start.getFullYear(), start.getMonth(), start.getDate() + days, 23, 59, 0, timeZone);
  return new Date(d.getTime());
}

function check(planKey: string, kind: CheckKind, dueAt: Date, timeZone: string): PlannedCheck {
  return { planKey, kind, dueAt, dueDate: localDate(dueAt, timeZone) };
}

function routineChecks(start: Date, rules: PolicySettings['schedule'], now: Date, tz: string): PlannedCheck[] {
  const out = [check('first-home', 'spot_check', new Date(start.getTime() + rules.firstCheckWithinHours * 3_600_000), tz)];
  for (let k = 1; k <= rules.weeklyChecks; k++) out.push(check(`week-${k}`, 'spot_check', endOfLocalDay(start, 7 * k, tz), tz));
  const horizon = now.getTime() + rules.planAheadWeeks * 7 * DAY_MS;
  for (let n = 1; n < 1000; n++) {
    const due = endOfLocalDay(start, 7 * (rules.weeklyChecks + n * rules.thenEveryWeeks), tz);
    if (due.getTime() > horizon) break;
    out.push(check(`every-${rules.thenEveryWeeks}w-${n}`, 'spot_check', due, tz));
  }
  return out;
}

/**
 * The checks a baby should have from the programme policy and the baby's state. Pure: the same input always gives
 * the same keys, so storing the plan is an upsert by key and a re-plan never duplicates a check.
 */
export function planChecks(state: PlanState, policy: PolicySettings, timeZone: string, now: Date): PlannedCheck[] {
  if (!state.homeStartAt || ['preparing', 'awaiting_signoff', 'sent_back', 'left_programme'].includes(state.status)) return [];
  const rules = policy.schedule;
  const out = routineChecks(state.homeStartAt, rules, now, timeZone);
  const active = state.active;
  if (state.status === 'off_oxygen' && state.offOxygenSince) {
    const day = localDate(state.offOxygenSince, timeZone);
    out.push(check(`room-air-${day}`, 'room_air_challenge', endOfLocalDay(state.offOxygenSince, policy.stepDown.offOxygenObservationDays, timeZone), timeZone));
    return out;
  }
  if (!active || active.flowLpm <= 0) return out;
  if (active.reason === 'step_down' || active.reason === 'step_up') {
    out.push(check(`follow-up-v${active.version}`, 'overnight_study', endOfLocalDay(active.approvedAt, rules.followUpDaysAfterStepDown, timeZone), timeZone));
  }
  // Each approved setting gets its own study and review before the next step down (common practice).
  const reviewDay = policy.stepDown.minDaysBetweenStepDowns;
  if (rules.overnightStudyBeforeStepDown) {
    out.push(check(`study-before-step-down-v${active.version}`, 'overnight_study', endOfLocalDay(active.approvedAt, Math.max(1, reviewDay - 2), timeZone), timeZone));
  }
  out.push(check(`step-down-review-v${active.version}`, 'step_down_review', endOfLocalDay(active.approvedAt, reviewDay, timeZone), timeZone));
  return out;
}
