import type { ReactNode } from 'react';

/** Label–value pairs as a description list; `className` sets the grid (columns, spacing, type size). */
export function FactList({ facts, className = 'mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1' }: { facts: ReadonlyArray<readonly [string, ReactNode]>; className?: string }) {
  return (
    <dl className={className}>
      {facts.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-ink-500">{label}</dt>
          <dd className="text-ink-900">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
