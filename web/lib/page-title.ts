import { useEffect } from 'react';

export const APP_NAME = 'Nestflow';

/** "<page> · <baby> · Nestflow", or "<page> · Nestflow" when the page is not about one baby (WCAG 2.4.2). */
export function pageTitle(page?: string, baby?: string): string {
  return [page, baby, APP_NAME].filter((part): part is string => Boolean(part && part.trim())).join(' · ');
}

/**
 * Names the browser tab after the page, so a screen reader, the tab strip and the history list tell pages apart.
 * Every route calls it once, at its top, with the baby's name as soon as it is known. Leaving the page puts back
 * the bare app name, so a page still loading never shows the previous page's title.
 */
export function usePageTitle(page: string | undefined, baby?: string): void {
  useEffect(() => {
    document.title = pageTitle(page, baby);
    return () => {
      document.title = APP_NAME;
    };
  }, [page, baby]);
}
