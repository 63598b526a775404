import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Response } from 'express';
import { stringify } from 'csv-stringify';
import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

/** Rows an export reads per query: one keyset page at a time, in the list's own order. */
export const EXPORT_PAGE_ROWS = 500;

/** One column of an export: its heading in plain words and how a row fills it. */
export interface CsvColumn<T> {
  heading: string;
  value: (row: T) => string | number | null | undefined;
}

/**
 * An instant as ISO 8601 with the offset it has in the programme's time zone, always written as ±hh:mm
 * ("2026-11-20T21:00:00+00:00", never "Z"), so one column reads the same all year.
 */
export const isoInZone = (instant: Date | string | null | undefined, timeZone: string): string =>
  instant ? format(new TZDate(new Date(instant), timeZone), "yyyy-MM-dd'T'HH:mm:ssxxx") : '';

export const yesNo = (v: boolean): string => (v ? 'yes' : 'no');

/**
 * Streams rows as a CSV download: UTF-8 with a byte-order mark (spreadsheet programs then read accents), CRLF line
 * ends (RFC 4180), and csv-stringify's `escape_formulas`, which puts a single quote before a text cell starting with
 * = + - @ tab or carriage return (and their full-width forms) so a spreadsheet shows it as text instead of running
 * it as a formula. Numbers stay numbers: a negative number is written as it is. Rows are pulled one page at a time
 * as the client reads (pipeline's back-pressure), so a long export never sits in memory whole.
 */
export async function sendCsv<T>(res: Response, filename: string, columns: CsvColumn<T>[], rows: AsyncIterable<T>): Promise<void> {
  res.status(200);
  res.set({
    'Content-Type': 'text/csv; charset=utf-8',
    'Content-Disposition': `attachment; filename="${filename}"`,
    // A record held in a shared browser cache would outlive the session that was allowed to read it.
    'Cache-Control': 'no-store',
  });
  async function* records() {
    for await (const row of rows) yield columns.map((c) => c.value(row) ?? '');
  }
  await pipeline(
    Readable.from(records()),
    stringify({ bom: true, header: true, columns: columns.map((c) => c.heading), escape_formulas: true, record_delimiter: 'windows' }),
    res,
  );
}
