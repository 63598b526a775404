import type { ReactNode } from 'react';
import type { Header } from '@tanstack/react-table';
import type { InfantSummary } from '../../../../shared/schemas/infants';
import type { caseloadFeatures } from './caseload-columns';

type CaseloadHeader = Header<typeof caseloadFeatures, InfantSummary, unknown>;

const arrows = { asc: '▲', desc: '▼' } as const;
const words = { asc: 'ascending', desc: 'descending' } as const;

/** The header cell carries aria-sort and the sort direction in words, not only an arrow. */
export function CaseloadSortHeader({ header, children, className = '' }: { header: CaseloadHeader; children: ReactNode; className?: string }) {
  const sorted = header.column.getIsSorted();
  const base = `px-2 py-2 font-semibold ${className}`;
  if (header.isPlaceholder) return <th className={base} />;
  if (!header.column.getCanSort()) {
    return (
      <th scope="col" className={base}>
        {children}
      </th>
    );
  }
  return (
    <th scope="col" className={base} aria-sort={sorted ? words[sorted] : 'none'}>
      <button
        type="button"
        onClick={header.column.getToggleSortingHandler()}
        className="inline-flex items-center gap-1 rounded px-1 py-0.5 font-semibold hover:bg-surface-200"
      >
        {children}
        <span aria-hidden="true" className="text-xs">
          {sorted ? arrows[sorted] : '↕'}
        </span>
        <span className="sr-only">{sorted ? `, sorted ${words[sorted]}` : ', sort'}</span>
      </button>
    </th>
  );
}
