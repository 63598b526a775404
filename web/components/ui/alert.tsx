import type { ReactNode } from 'react';

/** A form-level message that screen readers announce as soon as it appears. */
export function Alert({ children, tone = 'danger' }: { children: ReactNode; tone?: 'danger' | 'warn' }) {
  const classes = tone === 'danger' ? 'border-danger-200 bg-danger-50 text-danger-800' : 'border-warn-200 bg-warn-50 text-warn-800';
  return (
    <div role="alert" className={`rounded-lg border px-4 py-3 font-semibold ${classes}`}>
      {children}
    </div>
  );
}
