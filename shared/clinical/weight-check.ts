/**
 * Weight plausibility for what staff type (enrolment, record edits, readings). Errors outside 0.3–15 kg come from the
 * zod contracts; these are the unusual-but-possible values a person must confirm before they are saved, because a
 * slipped decimal (0.32 for 3.2 kg) changes the cannula model's effective FiO2 roughly tenfold.
 * - below 1.0 kg: possible for a very preterm baby, rare at discharge home (common practice);
 * - more than 20 % away from a weight recorded within the previous 14 days: more than an infant gains or loses in
 *   two weeks outside a keying error (common practice; healthy infants gain roughly 15–30 g a day, from memory).
 */
export const WEIGHT_RULES = Object.freeze({ minKg: 0.3, maxKg: 15, confirmBelowKg: 1.0, changeFraction: 0.2, changeWindowDays: 14 });

export interface PreviousWeight {
  kg: number;
  /** ISO date (YYYY-MM-DD) the previous weight was taken. */
  date: string;
}

const DAY_MS = 86_400_000;
const dayNumber = (isoDate: string) => Date.parse(`${isoDate.slice(0, 10)}T00:00:00Z`) / DAY_MS;

/** Sentences for each reason to double-check the weight; empty when nothing is unusual. */
export function weightWarnings(kg: number, date: string, previous: PreviousWeight | null): string[] {
  const warnings: string[] = [];
  if (kg < WEIGHT_RULES.confirmBelowKg) warnings.push(`${kg} kg is under ${WEIGHT_RULES.confirmBelowKg} kg: check the decimal point (e.g. 3.2, not 0.32).`);
  if (previous && previous.kg > 0) {
    const days = Math.abs(dayNumber(date) - dayNumber(previous.date));
    const change = (kg - previous.kg) / previous.kg;
    if (days <= WEIGHT_RULES.changeWindowDays && Math.abs(change) > WEIGHT_RULES.changeFraction + 1e-9) {
      const pct = Math.round(Math.abs(change) * 100);
      warnings.push(`${kg} kg is ${pct} % ${change > 0 ? 'more' : 'less'} than ${previous.kg} kg on ${previous.date.slice(0, 10)}: check the number.`);
    }
  }
  return warnings;
}
