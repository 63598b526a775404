import type { RecordingUploadFields } from '@shared/schemas/recordings';

type ColumnField = 'timestampColumn' | 'dateColumn' | 'timeColumn' | 'spo2Column' | 'pulseColumn' | 'statusColumn';
export type ColumnGuess = Partial<Pick<RecordingUploadFields, ColumnField>>;

// Common header words in oximeter exports; only a starting point, the person confirms every choice.
const DATE = /^\s*(date|day|datum)\s*$/i;
const CLOCK = /^\s*(time|clock|clock time|local time)\s*$/i;
const HINTS: [ColumnField, RegExp][] = [
  ['timestampColumn', /time|date|clock|^t$|elapsed|sec/i],
  ['spo2Column', /sp\s*o\s*2|sa\s*o\s*2|sat|^o2/i],
  ['pulseColumn', /pulse|^pr$|^hr$|heart|bpm|rate/i],
  ['statusColumn', /status|flag|alarm|quality|artefact|artifact|probe|signal|event/i],
];

/**
 * A first guess at which found header holds which value; a header is never used twice. A "Date" column beside a
 * "Time" column is a date and a clock time, not one timestamp.
 */
export function guessColumns(found: readonly string[]): ColumnGuess {
  const used = new Set<string>();
  const guess: ColumnGuess = {};
  const date = found.find((h) => DATE.test(h));
  const clock = found.find((h) => CLOCK.test(h));
  if (date !== undefined && clock !== undefined) {
    Object.assign(guess, { dateColumn: date, timeColumn: clock });
    used.add(date).add(clock);
  }
  for (const [field, pattern] of HINTS) {
    if (field === 'timestampColumn' && guess.dateColumn !== undefined) continue;
    const match = found.find((header) => !used.has(header) && pattern.test(header.trim()));
    if (match !== undefined) {
      guess[field] = match;
      used.add(match);
    }
  }
  return guess;
}
