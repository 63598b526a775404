import { useEffect } from 'react';
import { useLocation } from 'react-router-dom';

const HEADING = '[data-page-heading], main h1, h1';
// A page whose data never arrives should not grab focus minutes later.
const GIVE_UP_MS = 15_000;

/**
 * After every change of page (a menu link, a save that returns to a list, signing in or out) focus moves to the
 * new page's h1, so a screen reader reads where the person now is and Tab continues from the top of the page.
 * Pages often show a spinner first, so it waits for the heading to appear. Query strings (filters, sorting,
 * paging kept in the URL) are changes within a page and leave focus where it is. Focus moves just after the page
 * has been painted: focusing scrolls the heading into view, which needs the page laid out, and asked for before
 * the first paint that made the browser lay the whole page out one more time before showing it.
 */
export function useFocusOnNavigation(): void {
  const { pathname } = useLocation();
  useEffect(() => {
    let finished = false;
    const observer = new MutationObserver(() => soon());
    // The next frame's callback runs before its paint; a task queued from it runs after.
    function soon() {
      if (finished || frame !== undefined || afterPaint !== undefined) return;
      frame = requestAnimationFrame(() => {
        afterPaint = setTimeout(() => {
          frame = afterPaint = undefined;
          attempt();
        });
      });
    }
    let timer: ReturnType<typeof setTimeout> | undefined;
    let frame: number | undefined;
    let afterPaint: ReturnType<typeof setTimeout> | undefined;
    const finish = () => {
      finished = true;
      observer.disconnect();
      clearTimeout(timer);
      if (frame !== undefined) cancelAnimationFrame(frame);
      clearTimeout(afterPaint);
      document.removeEventListener('focusin', onFocusIn);
    };
    // Someone already working in the new page (typing, tabbing) keeps their place.
    function onFocusIn(event: FocusEvent) {
      const target = event.target as HTMLElement | null;
      if (target && target !== document.body && !target.matches(HEADING)) finish();
    }
    function attempt() {
      if (finished) return;
      const heading = document.querySelector<HTMLElement>(HEADING);
      if (!heading) return;
      if (!heading.hasAttribute('tabindex')) heading.tabIndex = -1;
      finish();
      heading.focus();
    }
    soon();
    if (!finished) {
      observer.observe(document.body, { childList: true, subtree: true });
      document.addEventListener('focusin', onFocusIn);
      timer = setTimeout(finish, GIVE_UP_MS);
    }
    return finish;
  }, [pathname]);
}
