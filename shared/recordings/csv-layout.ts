/**
 * How a device export is laid out before the table starts: which separator it uses (comma, semicolon or tab;
 * a semicolon usually means the values use a decimal comma) and how many lines of header text come before the
 * row of column names.
 */

export const SEPARATORS = [',', ';', '\t'] as const;
export type Separator = (typeof SEPARATORS)[number];

export interface CsvLayout {
  separator: Separator;
  /** Lines of text before the row of column names, and the characters they take. */
  skipLines: number;
  skipChars: number;
}

/** Lines looked at before deciding; a device's text header is a handful of lines. */
export const SAMPLE_LINES = 40;
const LINE_END = /\r\n|\r|\n/g;

/** Fields in one line under a separator; a separator inside double quotes does not count. */
export function countFields(line: string, separator: string): number {
  let fields = 1;
  let quoted = false;
  for (const c of line) {
    if (c === '"') quoted = !quoted;
    else if (c === separator && !quoted) fields += 1;
  }
  return fields;
}

/** The most frequent width and how often it occurs; a tie goes to the wider. */
function commonWidth(widths: number[]): { width: number; count: number } {
  const counts = new Map<number, number>();
  for (const w of widths) counts.set(w, (counts.get(w) ?? 0) + 1);
  let best = { width: 1, count: 0 };
  for (const [width, count] of counts) {
    if (count > best.count || (count === best.count && width > best.width)) best = { width, count };
  }
  return best;
}

/**
 * Decides the layout from the start of the text, or answers null while fewer than SAMPLE_LINES lines have arrived
 * and more may come. The separator is the one that splits most lines into the same number (two or more) of fields;
 * the table starts at the first line with at least that many, so a short header line before it is skipped but a
 * short data row after it is still reported by the reader. Without a separator that fits, a comma and no skip.
 */
export function sniffLayout(text: string, complete: boolean): CsvLayout | null {
  const lines: Array<{ text: string; start: number }> = [];
  let start = 0;
  for (const m of text.matchAll(LINE_END)) {
    lines.push({ text: text.slice(start, m.index), start });
    start = m.index + m[0].length;
    if (lines.length === SAMPLE_LINES) break;
  }
  if (lines.length < SAMPLE_LINES) {
    if (!complete) return null;
    lines.push({ text: text.slice(start), start });
  }
  const filled = lines.map((line, index) => ({ ...line, index })).filter((line) => line.text.trim() !== '');
  let chosen: { separator: Separator; width: number; count: number } = { separator: ',', width: 1, count: 0 };
  for (const separator of SEPARATORS) {
    const { width, count } = commonWidth(filled.map((line) => countFields(line.text, separator)));
    if (width >= 2 && (count > chosen.count || (count === chosen.count && width > chosen.width))) chosen = { separator, width, count };
  }
  if (chosen.width < 2) return { separator: ',', skipLines: 0, skipChars: 0 };
  const header = filled.find((line) => countFields(line.text, chosen.separator) >= chosen.width)!;
  return { separator: chosen.separator, skipLines: header.index, skipChars: header.start };
}
