import type { ReactNode } from 'react';

interface CardProps {
  title?: string;
  /** Heading level follows the page outline: pages use h1, so cards default to h2. */
  headingLevel?: 2 | 3;
  actions?: ReactNode;
  className?: string;
  children: ReactNode;
}

export function Card({ title, headingLevel = 2, actions, className = '', children }: CardProps) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section className={`rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6 ${className}`}>
      {(title || actions) && (
        <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
          {title && <Heading className="text-lg font-bold text-ink-900">{title}</Heading>}
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}
