import { Link } from 'react-router-dom';
import { INFANT_STATUS_LABELS, type InfantStatus } from '@shared/schemas/infants';

/** Every status with its count, each a link to the caseload filtered by it; a zero stays listed so the list never jumps. */
export function BabiesByStatus({ rows }: { rows: readonly { status: InfantStatus; count: number }[] }) {
  const total = rows.reduce((sum, r) => sum + r.count, 0);
  return (
    <div className="flex flex-col gap-3">
      <p className="text-ink-700">
        <span className="text-3xl font-bold tabular-nums text-ink-900">{total}</span> {total === 1 ? 'baby' : 'babies'} in the programme.{' '}
        <Link to="/caseload" className="font-semibold text-brand-700 underline">Open the caseload</Link>
      </p>
      <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
        {rows.map((r) => (
          <li key={r.status}>
            <Link to={`/caseload?status=${r.status}`} className="focus-inset flex items-baseline justify-between gap-3 px-3 py-2.5 hover:bg-brand-50">
              <span className="font-semibold text-brand-800 underline">{INFANT_STATUS_LABELS[r.status]}</span>{' '}
              <span className={`text-2xl font-bold tabular-nums ${r.count ? 'text-ink-900' : 'text-ink-500'}`}>{r.count}</span>
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
