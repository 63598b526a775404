import { formatDateTime } from '../../../lib/format';

const relative = new Intl.RelativeTimeFormat('en-GB', { numeric: 'auto' });
const UNITS: [Intl.RelativeTimeFormatUnit, number][] = [
  ['day', 86_400_000],
  ['hour', 3_600_000],
  ['minute', 60_000],
];

export function timeAgo(iso: string, now = Date.now()): string {
  const elapsed = now - new Date(iso).getTime();
  for (const [unit, ms] of UNITS) {
    if (elapsed >= ms) return relative.format(-Math.floor(elapsed / ms), unit);
  }
  return 'just now';
}

/** Relative for a quick scan of the queue, with the exact time beside it for the record. */
export function WaitingSince({ iso }: { iso: string }) {
  return (
    <span>
      <time dateTime={iso} className="font-semibold text-ink-900">
        {timeAgo(iso)}
      </time>{' '}
      <span className="text-ink-500">({formatDateTime(iso)})</span>
    </span>
  );
}
