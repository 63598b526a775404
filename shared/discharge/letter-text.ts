/**
 * The cautions printed with the setting in the discharge letter, for the clinicians who read it (our own words;
 * the same four points the product shows wherever a setting is shown).
 */
export const LETTER_CAUTIONS: readonly string[] = [
  'Decision support only: the figures support the treating team’s decision and are not a prescription on their own.',
  'A licensed clinician decides the setting; this one was approved by the consultant named above.',
  'Local protocols rule: follow your own service’s guidance where it differs.',
  'Oxygen fire safety: no smoking, vaping or open flames near the oxygen, keep it away from heat, and no oil-based creams on the face.',
];

/** The schedule of home checks in words, from the programme's settings. */
export function checksPlanText(s: { firstCheckWithinHours: number; weeklyChecks: number; thenEveryWeeks: number }): string {
  const weekly = s.weeklyChecks > 0 ? `, then weekly for ${s.weeklyChecks} week${s.weeklyChecks === 1 ? '' : 's'}` : '';
  return `Home checks (SpO2 and weight): the first within ${s.firstCheckWithinHours} hours of discharge${weekly}, then every ${s.thenEveryWeeks} week${s.thenEveryWeeks === 1 ? '' : 's'}.`;
}
