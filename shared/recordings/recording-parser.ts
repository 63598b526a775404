import { DEFAULT_ARTEFACT_RULES, medianSamplePeriodSec, orderSamples, type OximetrySample } from '../clinical/oximetry-samples';
import { resolveColumns, shownHeaders, type ColumnMapping, type ResolvedColumns } from './columns';
import { sniffLayout } from './csv-layout';
import { createCsvTokenizer, type CsvTokenizer } from './csv-tokenizer';
import { RECORDING_LIMITS, type RecordingTimeFormat } from './limits';
import type { DateOrder } from './local-dates';
import { addLocalRow, createLocalRows, localRowsToInstants } from './local-rows';
import { isFlaggedStatus, looksLikeSeconds, parseIsoMs, parseSecondsMs, parseValue, type Cell } from './values';

export type RecordingProblemCode =
  | 'empty_file' | 'malformed_csv' | 'wrong_columns' | 'unreadable_rows' | 'too_short' | 'too_long' | 'date_order_unclear' | 'clock_change';

/** A typed refusal: the parser never throws on bad input, it returns one of these. */
export interface RecordingProblem {
  code: RecordingProblemCode;
  message: string;
  line?: number;
  details?: Record<string, string[]>;
}

export interface ParsedRecording {
  /** Time-ordered; tSec counts from the earliest sample, at 1 ms; values at 0.1 (see values.ts). */
  samples: OximetrySample[];
  timeFormat: 'iso' | 'seconds';
  /** The earliest sample's time for ISO files; seconds-from-start files carry no clock time. */
  startedAt: string | null;
  samplePeriodSec: number;
  durationSec: number;
  dataRows: number;
  skippedRows: number;
  /** The row of column names as a refusal lists them (columns.ts): the key a mapping used for it is kept under. */
  header: string[];
}

export type RecordingParseResult = { ok: true; recording: ParsedRecording } | { ok: false; problem: RecordingProblem };

export interface RecordingParseOptions {
  columns?: ColumnMapping;
  timeFormat?: RecordingTimeFormat;
  /** For local clock times: the order of day and month (found from the dates when left out) and the zone. */
  dateOrder?: DateOrder;
  timeZone?: string;
}

const MAX_LISTED_LINES = 5;

/** Feeds text in any number of chunks; `finish` gives the recording or the first reason to refuse it. */
export function createRecordingParser(options: RecordingParseOptions = {}) {
  let format: 'iso' | 'seconds' | 'local' | null = options.timeFormat && options.timeFormat !== 'auto' ? options.timeFormat : null;
  let columns: ResolvedColumns | null = null;
  let header: string[] = [];
  const local = createLocalRows();
  let stopped: RecordingProblem | null = null;
  // Columns rather than an object per row: a night is tens of thousands of rows, and each object is garbage later.
  const read: ReadColumns = { times: [], spo2: [], pulse: [], flagged: [] };
  const badLines: Array<{ line: number; reason: string }> = [];
  let dataRows = 0;
  let unreadable = 0;

  function readTime(raw: string, line: number): Cell<number> {
    if (format === 'seconds') return parseSecondsMs(raw);
    if (format === 'iso') return parseIsoMs(raw);
    if (format === 'local') return readLocal(raw, null, line);
    if (raw.trim() === '') return { ok: false, reason: 'the timestamp is empty' };
    // 'auto' settles on the first timestamp that reads; every later row must then use the same form.
    if (looksLikeSeconds(raw)) return settle(parseSecondsMs(raw), 'seconds');
    const iso = parseIsoMs(raw);
    return iso.ok ? settle(iso, 'iso') : settle(readLocal(raw, null, line), 'local');
  }

  function settle(cell: Cell<number>, as: 'iso' | 'seconds' | 'local'): Cell<number> {
    if (cell.ok) format = as;
    return cell;
  }

  /** A local date and time: kept aside until the end, with 0 as a stand-in for the time. */
  function readLocal(date: string, time: string | null, line: number): Cell<number> {
    const cell = addLocalRow(local, date, time, line);
    return cell.ok ? { ok: true, value: 0 } : cell;
  }

  function onRecord(fields: string[], line: number) {
    if (!columns) {
      const resolved = resolveColumns(fields, options.columns);
      if (resolved.ok) {
        columns = resolved.columns;
        header = shownHeaders(fields);
        if (columns.timestamp === null) format = 'local';
        return null;
      }
      stopped = { code: 'wrong_columns', message: resolved.message, line, details: { found: resolved.found, missing: resolved.missing } };
      // Stryker disable next-line ObjectLiteral: only a stop signal to the tokenizer; asProblem reports `stopped`
      return { line, message: resolved.message };
    }
    dataRows += 1;
    const spo2 = parseValue(fields[columns.spo2], 'SpO2');
    const pulse: Cell<number | null> = columns.pulse === null ? { ok: true, value: null } : parseValue(fields[columns.pulse], 'pulse');
    // The time is read last: a local one is kept aside at once, so the row must be good otherwise.
    const time: Cell<number> = !spo2.ok || !pulse.ok ? { ok: true, value: 0 }
      : columns.timestamp === null ? readLocal(fields[columns.date!], fields[columns.time!], line) : readTime(fields[columns.timestamp], line);
    if (!time.ok || !spo2.ok || !pulse.ok) {
      unreadable += 1;
      // When SpO2 read, the pulse or the time failed.
      const reason = !spo2.ok ? spo2.reason : !pulse.ok ? pulse.reason : (time as { reason: string }).reason;
      if (badLines.length < MAX_LISTED_LINES) badLines.push({ line, reason });
      return null;
    }
    read.times.push(time.value);
    read.spo2.push(spo2.value);
    read.pulse.push(pulse.value);
    read.flagged.push(columns.status === null ? false : isFlaggedStatus(fields[columns.status]));
    return null;
  }

  // The separator and any header text before the column names are decided from the first lines, so text is held
  // back until enough of it has arrived.
  let tokenizer: CsvTokenizer | null = null;
  let pending = '';
  function begin(complete: boolean) {
    const layout = sniffLayout(pending, complete);
    if (!layout) return null;
    tokenizer = createCsvTokenizer(onRecord, { separator: layout.separator, firstLine: layout.skipLines + 1 });
    const text = pending.slice(layout.skipChars);
    pending = '';
    return tokenizer.push(text);
  }
  const asProblem = (csv: { line: number; message: string }): RecordingProblem =>
    stopped ?? { code: 'malformed_csv', message: `The file is not valid CSV. ${csv.message}`, line: csv.line, details: { line: [String(csv.line)] } };

  function localTimes(): RecordingProblem | null {
    const outcome = localRowsToInstants(local, { dateOrder: options.dateOrder, timeZone: options.timeZone ?? 'UTC' });
    // The headers go back too: both are settled in the matching step (a date order, the clock's time zone).
    if (!outcome.ok) return { code: outcome.code, message: outcome.message, line: outcome.line, details: { found: header } };
    unreadable += outcome.bad.length;
    badLines.push(...outcome.bad.slice(0, MAX_LISTED_LINES));
    badLines.sort((a, b) => a.line - b.line);
    const keep = outcome.times.map((t) => t !== null);
    read.times = outcome.times.filter((t): t is number => t !== null);
    read.spo2 = read.spo2.filter((_, i) => keep[i]);
    read.pulse = read.pulse.filter((_, i) => keep[i]);
    read.flagged = read.flagged.filter((_, i) => keep[i]);
    return null;
  }

  return {
    push(chunk: string): RecordingProblem | null {
      if (tokenizer) {
        const csv = tokenizer.push(chunk);
        return csv ? asProblem(csv) : null;
      }
      pending += chunk;
      const csv = begin(false);
      return csv ? asProblem(csv) : null;
    },
    finish(): RecordingParseResult {
      const early = tokenizer ? null : begin(true);
      if (early) return { ok: false, problem: asProblem(early) };
      const csv = tokenizer!.finish();
      if (csv) return { ok: false, problem: asProblem(csv) };
      if (!columns) return { ok: false, problem: { code: 'empty_file', message: 'The file has no rows.' } };
      const timesProblem = format === 'local' ? localTimes() : null;
      if (timesProblem) return { ok: false, problem: timesProblem };
      const allowed = Math.max(1, Math.floor(dataRows * RECORDING_LIMITS.unreadableRowShare));
      if (unreadable > allowed) {
        const listed = badLines.slice(0, MAX_LISTED_LINES).map((b) => `line ${b.line}: ${b.reason}`);
        const message = `${unreadable} of ${dataRows} rows could not be read (at most ${allowed} may be skipped); first at ${listed[0]}.`;
        return { ok: false, problem: { code: 'unreadable_rows', message, line: badLines[0].line, details: { lines: listed } } };
      }
      return finishSamples(read, format === 'seconds' ? 'seconds' : 'iso', dataRows, unreadable, header);
    },
  };
}

interface ReadColumns {
  times: number[];
  spo2: Array<number | null>;
  pulse: Array<number | null>;
  flagged: boolean[];
}

function finishSamples(read: ReadColumns, format: 'iso' | 'seconds', dataRows: number, skippedRows: number, header: string[]): RecordingParseResult {
  const { times } = read;
  const n = times.length;
  if (n < RECORDING_LIMITS.minSamples) {
    const message = `The file holds ${n} readable sample${n === 1 ? '' : 's'}; at least ${RECORDING_LIMITS.minSamples} are needed.`;
    return { ok: false, problem: { code: 'too_short', message } };
  }
  let ascending = true;
  let first = times[0];
  for (let i = 1; i < n; i += 1) {
    if (times[i] < times[i - 1]) ascending = false;
    if (times[i] < first) first = times[i];
  }
  const order = ascending ? null : Array.from({ length: n }, (_, i) => i).sort((a, b) => times[a] - times[b] || a - b);
  // Stryker disable next-line ArrayDeclaration: preallocation only; the loop below writes every index
  const samples = new Array<OximetrySample>(n);
  for (let k = 0; k < n; k += 1) {
    const i = order ? order[k] : k;
    samples[k] = { tSec: (times[i] - first) / 1000, spo2: read.spo2[i], pulse: read.pulse[i], flagged: read.flagged[i] };
  }
  const samplePeriodSec = medianSamplePeriodSec(orderSamples(samples, DEFAULT_ARTEFACT_RULES));
  const durationSec = samples[n - 1].tSec + samplePeriodSec;
  if (durationSec > RECORDING_LIMITS.maxDurationHours * 3600) {
    const hours = (durationSec / 3600).toFixed(1);
    const message = `The recording spans ${hours} hours; one upload may span at most ${RECORDING_LIMITS.maxDurationHours} hours (one night).`;
    return { ok: false, problem: { code: 'too_long', message } };
  }
  const startedAt = format === 'iso' ? new Date(first).toISOString() : null;
  return { ok: true, recording: { samples, timeFormat: format, startedAt, samplePeriodSec, durationSec, dataRows, skippedRows, header } };
}

/** The whole text at once; the same result as any chunking of it. */
export function parseRecordingCsv(text: string, options: RecordingParseOptions = {}): RecordingParseResult {
  const parser = createRecordingParser(options);
  const early = parser.push(text);
  return early ? { ok: false, problem: early } : parser.finish();
}
