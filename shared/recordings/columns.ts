/** Which column of a recording file holds which value: our own header names, or a mapping for other exports. */

export const OWN_HEADERS = { timestamp: 'timestamp', spo2: 'spo2', pulse: 'pulse', status: 'status' } as const;
export type ColumnRole = keyof typeof OWN_HEADERS;

export interface ColumnMapping {
  timestampColumn?: string;
  /** A date column and a time column, in the device's local time, instead of one timestamp column. */
  dateColumn?: string;
  timeColumn?: string;
  spo2Column?: string;
  pulseColumn?: string;
  statusColumn?: string;
}

export interface ResolvedColumns {
  /** Null when the time comes from a date column and a time column. */
  timestamp: number | null;
  date?: number;
  time?: number;
  spo2: number;
  pulse: number | null;
  status: number | null;
}

export type ColumnsOutcome =
  | { ok: true; columns: ResolvedColumns }
  | { ok: false; message: string; found: string[]; missing: string[] };

type AnyRole = ColumnRole | 'date' | 'time';
const ROLES: ColumnRole[] = ['timestamp', 'spo2', 'pulse', 'status'];
const DATE_TIME_ROLES: AnyRole[] = ['date', 'time', 'spo2', 'pulse', 'status'];
const key = (name: string) => name.trim().toLowerCase();
// The header list goes back to the web for a mapping step; a hostile header must not make the answer huge.
export const shownHeaders = (header: readonly string[]) => header.slice(0, 50).map((h) => (h.length > 60 ? `${h.slice(0, 60)}…` : h));

export const hasMapping = (m?: ColumnMapping) =>
  !!m && [m.timestampColumn, m.dateColumn, m.timeColumn, m.spo2Column, m.pulseColumn, m.statusColumn].some((v) => v !== undefined);

const usesDateAndTime = (m?: ColumnMapping) => m?.dateColumn !== undefined || m?.timeColumn !== undefined;

/**
 * Header names match ignoring case and surrounding spaces. Without a mapping the file must carry our own
 * timestamp, spo2 and pulse columns. With one, each named column must exist; a role left out falls back to our
 * name, and pulse becomes optional because several exports carry none (the analysis allows a missing pulse).
 * A date column and a time column replace the timestamp; both must be named.
 */
export function resolveColumns(header: readonly string[], mapping?: ColumnMapping): ColumnsOutcome {
  const mapped = hasMapping(mapping);
  const found = shownHeaders(header);
  const missing: string[] = [];
  const problems: string[] = [];
  const index: Partial<Record<AnyRole, number | null>> = {};
  const roles = usesDateAndTime(mapping) ? DATE_TIME_ROLES : ROLES;
  for (const role of roles) {
    const explicit = mapping?.[`${role}Column`];
    const name = explicit ?? (role === 'date' || role === 'time' ? `${role}Column` : OWN_HEADERS[role]);
    const required = explicit !== undefined || (role !== 'pulse' && role !== 'status') || (role === 'pulse' && !mapped);
    const at = header.flatMap((h, i) => (key(h) === key(name) ? [i] : []));
    if (at.length > 1) problems.push(`the column "${name}" appears ${at.length} times`);
    if (at.length === 0 && required) missing.push(explicit !== undefined ? `${role}Column: ${name}` : name);
    index[role] = at.length === 1 ? at[0] : null;
  }
  const used = roles.map((r) => index[r]).filter((i): i is number => i !== null && i !== undefined);
  if (new Set(used).size !== used.length) problems.push('one column is chosen for two different values');
  if (!missing.length && !problems.length) {
    const rest = { spo2: index.spo2!, pulse: index.pulse ?? null, status: index.status ?? null };
    if (index.timestamp === undefined) return { ok: true, columns: { timestamp: null, date: index.date!, time: index.time!, ...rest } };
    return { ok: true, columns: { timestamp: index.timestamp!, ...rest } };
  }
  const list = found.length ? found.map((h) => `"${h}"`).join(', ') : 'none';
  const message = problems.length
    ? `The columns cannot be read: ${problems.join('; ')}. Columns found: ${list}.`
    : mapped
      ? `The file has no column named ${missing.map((m) => `"${m.replace(/^\w+Column: /, '')}"`).join(', ')}. Columns found: ${list}.`
      : `The file's columns are not in the Nestflow recording format (timestamp, spo2, pulse, and optionally status). ` +
        `Columns found: ${list}. Choose which column holds each value and upload again.`;
  return { ok: false, message, found, missing };
}
