/**
 * A strict, incremental CSV reader (RFC 4180 quoting, comma-, semicolon- or tab-separated, LF, CRLF or CR line
 * ends).
 *
 * Why our own and not csv-parse: shared/ also runs in the browser, and csv-parse needs Node's Buffer; and a
 * 43,200-row overnight file must parse well inside docs/service-targets.md P4 (csv-parse alone took ~100 ms for one night,
 * several times a COPY of the same rows). tests/shared/recordings checks this reader against csv-parse.
 *
 * Strict means: every record has as many fields as the first one, a quote may only open a field and must be
 * closed, and nothing but a comma or a line end may follow a closing quote. Chunks may split the text anywhere
 * (inside a quoted field, between CR and LF, between the halves of a surrogate pair) without changing the result.
 */

export interface CsvProblem {
  /** 1-based line of the file where the faulty record starts (or where the unclosed quote opened). */
  line: number;
  message: string;
}

/** Receives each record with the line it starts on; returning a problem stops the reader. */
export type CsvRecordHandler = (fields: string[], line: number) => CsvProblem | null | undefined | void;

export interface CsvTokenizer {
  push(chunk: string): CsvProblem | null;
  finish(): CsvProblem | null;
}

export interface CsvTokenizerOptions {
  /** The field separator (csv-layout.ts finds it); a comma unless told. */
  separator?: ',' | ';' | '\t';
  /** The file line the text starts on, when lines before it were skipped. */
  firstLine?: number;
}

const SEPARATOR_WORDS = { ',': 'a comma', ';': 'a semicolon', '\t': 'a tab' } as const;
const QUOTE = 34;
const LF = 10;
const CR = 13;
const BOM = 0xfeff;

const enum State {
  FieldStart,
  Unquoted,
  Quoted,
  /** Inside a quoted field, just after a quote: either an escaped quote or the closing one. */
  QuoteInQuoted,
  /** Just after a CR ending a record: a following LF belongs to the same line end. */
  AfterCr,
}

export function createCsvTokenizer(onRecord: CsvRecordHandler, options: CsvTokenizerOptions = {}): CsvTokenizer {
  const separator = options.separator ?? ',';
  const SEP = separator.charCodeAt(0);
  let state: State = State.FieldStart;
  let line = options.firstLine ?? 1;
  let recordLine = line;
  let quoteLine = line;
  let fields: string[] = [];
  let field = '';
  let fieldQuoted = false;
  let width = -1;
  let started = false;
  let crInQuotes = false;
  let problem: CsvProblem | null = null;

  const fail = (at: number, message: string) => (problem = { line: at, message });

  function endRecord(): CsvProblem | null {
    fields.push(field);
    const record = fields;
    const blank = record.length === 1 && record[0] === '' && !fieldQuoted;
    fields = [];
    field = '';
    fieldQuoted = false;
    if (blank) return null;
    if (width < 0) width = record.length;
    else if (record.length !== width) {
      return fail(recordLine, `Line ${recordLine} has ${record.length} values but the header has ${width}.`);
    }
    const stop = onRecord(record, recordLine);
    return stop ? (problem = stop) : null;
  }

  /** Scans a quoted run up to the next quote, counting line ends inside it. */
  function scanQuoted(chunk: string, from: number): number {
    let j = from;
    for (; j < chunk.length; j += 1) {
      const c = chunk.charCodeAt(j);
      if (c === QUOTE) break;
      if (c === LF) {
        if (!crInQuotes) line += 1;
        crInQuotes = false;
      } else if (c === CR) {
        line += 1;
        crInQuotes = true;
      } else crInQuotes = false;
    }
    field += chunk.slice(from, j);
    return j;
  }

  function push(chunk: string): CsvProblem | null {
    if (problem) return problem;
    let i = 0;
    if (!started && chunk.length > 0) {
      started = true;
      if (chunk.charCodeAt(0) === BOM) i = 1;
    }
    const n = chunk.length;
    while (i < n) {
      if (state === State.Quoted) {
        const j = scanQuoted(chunk, i);
        if (j === n) return null;
        state = State.QuoteInQuoted;
        i = j + 1;
        continue;
      }
      const c = chunk.charCodeAt(i);
      if (state === State.QuoteInQuoted) {
        crInQuotes = false;
        if (c === QUOTE) {
          field += '"';
          state = State.Quoted;
          i += 1;
          continue;
        }
        if (c !== SEP && c !== LF && c !== CR) return fail(line, `Line ${line}: only ${SEPARATOR_WORDS[separator]} or a line end may follow a closing quote.`);
        state = State.Unquoted;
      } else if (state === State.AfterCr) {
        state = State.FieldStart;
        if (c === LF) {
          i += 1;
          continue;
        }
      }
      if (c === SEP) {
        fields.push(field);
        field = '';
        fieldQuoted = false;
        state = State.FieldStart;
        i += 1;
      } else if (c === LF || c === CR) {
        if (endRecord()) return problem;
        line += 1;
        recordLine = line;
        state = c === CR ? State.AfterCr : State.FieldStart;
        i += 1;
      } else if (c === QUOTE) {
        if (state !== State.FieldStart) return fail(line, `Line ${line}: a quote mark appears inside a value that does not start with one.`);
        fieldQuoted = true;
        quoteLine = line;
        state = State.Quoted;
        i += 1;
      } else {
        let j = i + 1;
        // Stryker disable next-line EqualityOperator: `<=` reads NaN past the end, `>=` scans a character a pass: same value
        for (; j < n; j += 1) {
          const d = chunk.charCodeAt(j);
          if (d === SEP || d === LF || d === CR || d === QUOTE) break;
        }
        field += chunk.slice(i, j);
        state = State.Unquoted;
        i = j;
      }
    }
    return null;
  }

  function finish(): CsvProblem | null {
    if (problem) return problem;
    if (state === State.Quoted) return fail(quoteLine, `Line ${quoteLine}: a quoted value is never closed.`);
    if (fields.length > 0 || field !== '' || fieldQuoted) return endRecord();
    return null;
  }

  return { push, finish };
}
