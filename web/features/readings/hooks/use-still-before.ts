import { useEffect, useState } from 'react';

// setTimeout cannot wait longer than this; the edit window is at most a day anyway.
const MAX_DELAY_MS = 2 ** 31 - 1;

/** True until `untilIso` passes, and re-renders at that moment so a "Correct" button goes away on its own. */
export function useStillBefore(untilIso: string | null): boolean {
  // The clock is read when the component first shows and again when the deadline comes, never during a render.
  const [now, setNow] = useState(() => Date.now());
  const until = untilIso ? Date.parse(untilIso) : Number.NaN;
  const open = Number.isFinite(until) && now < until;
  useEffect(() => {
    if (!open) return;
    const timer = setTimeout(() => setNow(Date.now()), Math.min(until - Date.now() + 50, MAX_DELAY_MS));
    return () => clearTimeout(timer);
  }, [open, until]);
  return open;
}
