import { useState } from 'react';

/**
 * The time when the component first showed, fixed for its life: "upcoming" and "earlier" lists only need the
 * minute, and reading the clock on every render would make the same props draw different things.
 */
export function useNow(): number {
  const [now] = useState(() => Date.now());
  return now;
}
