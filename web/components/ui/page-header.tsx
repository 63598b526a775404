import type { ReactNode } from 'react';
import { PageHeading } from './page-heading';

export function PageHeader({ title, intro, actions }: { title: string; intro?: string; actions?: ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <PageHeading>{title}</PageHeading>
        {intro && <p className="mt-1 max-w-prose text-ink-700">{intro}</p>}
      </div>
      {actions}
    </div>
  );
}

/** The family pages' larger heading and introduction (phone first, large type). */
export function FamilyPageHeader({ title, intro }: { title: string; intro?: ReactNode }) {
  return (
    <div>
      <PageHeading className="text-3xl font-bold text-ink-900 sm:text-4xl">{title}</PageHeading>
      {intro && <p className="mt-2 text-xl leading-relaxed text-ink-700">{intro}</p>}
    </div>
  );
}
