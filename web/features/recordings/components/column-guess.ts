import type { RecordingUploadFields } from '../../../../shared/schemas/recordings';

type ColumnField = 'timestampColumn' | 'spo2Column' | 'pulseColumn' | 'statusColumn';

// Common header words in oximeter exports; only a starting point, the person confirms every choice.
const HINTS: [ColumnField, RegExp][] = [
  ['timestampColumn', /time|date|clock|^t$|elapsed|sec/i],
  ['spo2Column', /sp\s*o\s*2|sa\s*o\s*2|sat|^o2/i],
  ['pulseColumn', /pulse|^pr$|^hr$|heart|bpm|rate/i],
  ['statusColumn', /status|flag|alarm|quality|artefact|artifact|probe|signal|event/i],
];

/** A first guess at which found header holds which value; a header is never used twice. */
export function guessColumns(found: readonly string[]): Partial<Pick<RecordingUploadFields, ColumnField>> {
  const used = new Set<string>();
  const guess: Partial<Record<ColumnField, string>> = {};
  for (const [field, pattern] of HINTS) {
    const match = found.find((header) => !used.has(header) && pattern.test(header.trim()));
    if (match !== undefined) {
      guess[field] = match;
      used.add(match);
    }
  }
  return guess;
}
