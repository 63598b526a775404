import type { ReactNode } from 'react';

interface EmptyStateProps {
  message: string;
  children?: ReactNode;
  large?: boolean;
}

export function EmptyState({ message, children, large = false }: EmptyStateProps) {
  return (
    <div className="flex flex-col items-start gap-3 rounded-xl border border-dashed border-surface-300 bg-surface-50 p-4">
      <p className={large ? 'text-xl leading-relaxed text-ink-700' : 'text-ink-700'}>{message}</p>
      {children}
    </div>
  );
}
