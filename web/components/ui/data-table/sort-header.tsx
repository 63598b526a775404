import type { ReactNode } from 'react';
import type { Header, RowData } from '@tanstack/react-table';
import type { ServerTableFeatures } from './use-server-table';

const arrows = { asc: '▲', desc: '▼' } as const;
const words = { asc: 'ascending', desc: 'descending' } as const;

interface SortHeaderProps<TData extends RowData> {
  header: Header<ServerTableFeatures, TData, unknown>;
  children: ReactNode;
  className: string;
}

/** The header cell carries aria-sort and the sort direction in words, not only an arrow. */
export function SortHeader<TData extends RowData>({ header, children, className }: SortHeaderProps<TData>) {
  const sorted = header.column.getIsSorted();
  if (header.isPlaceholder) return <th className={className} />;
  if (!header.column.getCanSort()) {
    return (
      <th scope="col" className={className}>
        {children}
      </th>
    );
  }
  return (
    <th scope="col" className={className} aria-sort={sorted ? words[sorted] : 'none'}>
      <button
        type="button"
        onClick={header.column.getToggleSortingHandler()}
        className="focus-inset inline-flex items-center gap-1 rounded px-1 py-0.5 font-semibold hover:bg-surface-200"
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
