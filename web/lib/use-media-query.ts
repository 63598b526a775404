import { useSyncExternalStore } from 'react';

/**
 * Whether a CSS media query matches now, kept in step as the window changes. Where the browser offers no
 * matchMedia (jsdom in tests), `fallback` stands in.
 */
export function useMediaQuery(query: string, fallback: boolean): boolean {
  return useSyncExternalStore(
    (onChange) => {
      if (typeof window.matchMedia !== 'function') return () => undefined;
      const list = window.matchMedia(query);
      list.addEventListener('change', onChange);
      return () => list.removeEventListener('change', onChange);
    },
    () => (typeof window.matchMedia === 'function' ? window.matchMedia(query).matches : fallback),
    () => fallback,
  );
}

/** Tailwind's `md` breakpoint: below it a table of many columns becomes one card per row. */
export const WIDE_SCREEN = '(min-width: 48rem)';
