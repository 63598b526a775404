import type { z } from 'zod';

/** Where each default comes from, shown under its field; a default with no entry here has no cited source. */
export const SOURCES = {
  satTargets: 'TSANZ 2020 / BTS 2009',
  pulmonaryHypertension: 'Starship guideline',
  commonPractice: 'common practice',
  spotMean: 'NHS GGC neonatal home-oxygen guideline',
  spotLow: 'ATS 2019 (spot readings ≤ 90 % under 1 year)',
  minValidTime: 'Urschitz 2003 (studies under 5 h excluded)',
  eventTime: 'adult scoring convention, from memory; CHIME counted falls of ≥ 5 s',
} as const;

export interface Range {
  min: number;
  max: number;
  /** False when the lowest value itself is not allowed (e.g. "above 0"). */
  minAllowed: boolean;
}

/** The limits the shared schema puts on a number, scaled for fields shown in other units (fraction → points). */
export function rangeOf(schema: z.ZodNumber, scale = 1): Range | undefined {
  const { minValue, maxValue } = schema;
  if (minValue === null || maxValue === null || !Number.isFinite(minValue) || !Number.isFinite(maxValue)) return undefined;
  const tidy = (n: number) => Number((n * scale).toFixed(4));
  return { min: tidy(minValue), max: tidy(maxValue), minAllowed: schema.safeParse(minValue).success };
}

export const rangeText = (range: Range, unit = '') =>
  range.minAllowed ? `Allowed ${range.min}–${range.max}${unit}` : `Allowed above ${range.min}, up to ${range.max}${unit}`;

/** zod's built-in wording ("Too small: expected number to be >=85") becomes the field's own range in plain words. */
export function readableError(message: string | undefined, range: Range | undefined): string | undefined {
  if (!message) return undefined;
  if (/^Invalid input/.test(message)) return 'Enter a number';
  if (range && /^Too (small|big)/.test(message)) {
    return range.minAllowed ? `Use a value from ${range.min} to ${range.max}` : `Use a value above ${range.min} and up to ${range.max}`;
  }
  return message;
}
