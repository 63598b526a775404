import { addDays, completedMonthsBetween, daysBetween } from './dates';

// Term is 40 weeks postmenstrual; corrected age subtracts the weeks born before it (AAP 2004).
export const TERM_DAYS = 280;

export interface WeeksDays {
  weeks: number;
  days: number;
}

export interface AgesInput {
  birthDate: string;
  gestationAtBirth: WeeksDays;
  atDate: string;
}

export interface Ages {
  /** AAP 2004: gestational age is stated in completed weeks; 25+5 is "25 weeks", never rounded up. */
  gestationAtBirth: WeeksDays & { totalDays: number; completedWeeks: number };
  chronological: WeeksDays & { totalDays: number; completedMonths: number };
  postmenstrual: WeeksDays & { totalDays: number };
  /** Negative before term-equivalent; completedMonths is null until then. */
  corrected: WeeksDays & { totalDays: number; completedMonths: number | null; termEquivalentDate: string };
}

/** Whole weeks and days of the same sign: −15 d is −2 wk −1 d, not −3 wk +6 d. */
export function splitWeeksDays(totalDays: number): WeeksDays {
  const sign = totalDays < 0 ? -1 : 1;
  const absolute = Math.abs(totalDays);
  return { weeks: sign * Math.floor(absolute / 7) || 0, days: sign * (absolute % 7) || 0 };
}

// A guard against typing errors, not a clinical limit: live births outside 18–45 weeks are not plausible entries.
function assertGestation({ weeks, days }: WeeksDays): void {
  if (!Number.isInteger(weeks) || weeks < 18 || weeks > 45) throw new RangeError('Gestation weeks must be 18–45');
  if (!Number.isInteger(days) || days < 0 || days > 6) throw new RangeError('Gestation days must be 0–6');
}

/**
 * AAP 2004 age terminology. Term-born babies (≥ 40 wk) are not corrected: there are no weeks born before term to
 * subtract, so their corrected age equals their chronological age.
 */
export function agesAt(input: AgesInput): Ages {
  assertGestation(input.gestationAtBirth);
  const gestationDays = input.gestationAtBirth.weeks * 7 + input.gestationAtBirth.days;
  const chronologicalDays = daysBetween(input.birthDate, input.atDate);
  if (chronologicalDays < 0) throw new RangeError('The date is before birth');
  const prematurityDays = Math.max(0, TERM_DAYS - gestationDays);
  const correctedDays = chronologicalDays - prematurityDays;
  const termEquivalentDate = addDays(input.birthDate, prematurityDays);
  const postmenstrualDays = gestationDays + chronologicalDays;
  return {
    gestationAtBirth: {
      ...splitWeeksDays(gestationDays),
      totalDays: gestationDays,
      completedWeeks: input.gestationAtBirth.weeks,
    },
    chronological: {
      ...splitWeeksDays(chronologicalDays),
      totalDays: chronologicalDays,
      completedMonths: completedMonthsBetween(input.birthDate, input.atDate),
    },
    postmenstrual: { ...splitWeeksDays(postmenstrualDays), totalDays: postmenstrualDays },
    corrected: {
      ...splitWeeksDays(correctedDays),
      totalDays: correctedDays,
      completedMonths: correctedDays < 0 ? null : completedMonthsBetween(termEquivalentDate, input.atDate),
      termEquivalentDate,
    },
  };
}

/** "25+5 wk", the usual perinatal notation for gestational and postmenstrual age. */
export function formatWeeksPlusDays({ weeks, days }: WeeksDays): string {
  return `${weeks}+${days} wk`;
}

function formatWeeksAndDays(totalDays: number): string {
  const { weeks, days } = splitWeeksDays(Math.abs(totalDays));
  if (weeks === 0) return `${days} d`;
  return days === 0 ? `${weeks} wk` : `${weeks} wk ${days} d`;
}

/**
 * Weeks and days while the infant is young (under 3 corrected months), where a week matters; whole months after,
 * years and months from 2 years. Before term-equivalent the text says so rather than showing a minus sign.
 */
export function formatCorrectedAge(corrected: Ages['corrected']): string {
  if (corrected.totalDays < 0) return `${formatWeeksAndDays(corrected.totalDays)} before term`;
  const months = corrected.completedMonths ?? 0;
  if (months < 3) return formatWeeksAndDays(corrected.totalDays);
  if (months < 24) return `${months} mo`;
  const years = Math.floor(months / 12);
  return months % 12 === 0 ? `${years} y` : `${years} y ${months % 12} mo`;
}
