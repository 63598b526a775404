// What the logs must never hold: people's names, phone numbers, e-mail addresses and clinical values (SpO2, pulse).
// Keys are redacted by name wherever they sit in a logged object; string values are scanned for e-mail addresses
// and phone-like digit runs, so an identifier inside an error message is masked too.

export const REDACTED = '[redacted]';

/** Field names whose values are never logged (matched case-insensitively, anywhere in the object). */
const SENSITIVE_KEY = /(^|_|-|\b)(name|names|given|family|surname|first_?name|last_?name|full_?name|display_?name|email|e_?mail|phone|mobile|msisdn|to|from|recipient|address|postcode|spo2|sp_?o2|saturation|pulse|heart_?rate|notes?|body|text|password|token|secret|cookie|authorization|dob|date_?of_?birth|nhs|mrn)$/i;

const EMAIL = /[A-Za-z0-9._%+-]+@[A-Za-z0-9.-]+\.[A-Za-z]{2,}/g;
// Seven or more digits, allowing spaces, dots, dashes and brackets between them, with an optional leading +.
const PHONE = /\+?\(?\d(?:[\s().-]*\d){6,}/g;
// "SpO2 91", "spo2=88 %", "saturation: 93" — the number after a clinical word.
const CLINICAL = /\b(spo2|sp_?o2|saturation|sats|pulse|heart rate)(\s*[:=]?\s*)\d{1,3}(\.\d+)?\s*%?/gi;

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;
const ISO_DATE_TIME = /\d{4}-\d{2}-\d{2}(?:[T ]\d{2}:\d{2}(?::\d{2}(?:\.\d+)?)?(?:Z|[+-]\d{2}:?\d{2})?)?/g;
// Record ids and timestamps are what an operator traces by; they are kept whole, everything else is scanned.
const KEEP = new RegExp(`${UUID.source}|${ISO_DATE_TIME.source}`, 'gi');

function scrubPart(text: string): string {
  return text.replace(EMAIL, REDACTED).replace(CLINICAL, `$1$2${REDACTED}`).replace(PHONE, REDACTED);
}

export function scrubText(text: string): string {
  let out = '';
  let last = 0;
  for (const m of text.matchAll(KEEP)) {
    out += scrubPart(text.slice(last, m.index)) + m[0];
    last = m.index + m[0].length;
  }
  return out + scrubPart(text.slice(last));
}

export const isSensitiveKey = (key: string) => SENSITIVE_KEY.test(key.replace(/([a-z0-9])([A-Z])/g, '$1_$2'));

/** A copy of a value fit for the log: sensitive keys replaced, strings scrubbed, depth and size bounded. */
export function redactValue(value: unknown, depth = 0, seen = new WeakSet<object>()): unknown {
  if (typeof value === 'string') return scrubText(value);
  if (value === null || typeof value !== 'object') return value;
  if (seen.has(value) || depth > 6) return '[…]';
  seen.add(value);
  if (value instanceof Error) {
    return { type: value.name, message: scrubText(value.message), code: (value as { code?: unknown }).code, stack: value.stack ? scrubText(value.stack) : undefined };
  }
  if (Array.isArray(value)) return value.slice(0, 50).map((v) => redactValue(v, depth + 1, seen));
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value)) out[k] = isSensitiveKey(k) ? REDACTED : redactValue(v, depth + 1, seen);
  return out;
}
