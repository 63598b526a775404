import type { ReactNode } from 'react';

export function PageHeader({ title, intro, actions }: { title: string; intro?: string; actions?: ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-2xl font-bold text-ink-900 sm:text-3xl">{title}</h1>
        {intro && <p className="mt-1 max-w-prose text-ink-700">{intro}</p>}
      </div>
      {actions}
    </div>
  );
}
