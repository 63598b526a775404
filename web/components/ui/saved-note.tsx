import type { ReactNode } from 'react';
import { useFocusOnArrival } from './focus';

/**
 * "Saved" where the save happened, taking focus so a screen reader reads it and the keyboard carries on from here.
 * Give it a new `key` on every save so each one is confirmed again.
 */
export function SavedNote({ children, large = false }: { children: ReactNode; large?: boolean }) {
  const note = useFocusOnArrival<HTMLDivElement>();
  return (
    <div ref={note} tabIndex={-1} className={`scroll-mt-4 rounded-xl border-2 border-ok-200 bg-ok-50 px-4 py-3 font-semibold text-ok-800 ${large ? 'text-xl' : ''}`}>
      <span aria-hidden="true">✓ </span>
      <span>{children}</span>
    </div>
  );
}
