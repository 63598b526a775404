import { useEffect, useRef } from 'react';

/**
 * Focus for the result of a save (WCAG 4.1.3, 2.4.3): the panel that appears after it ("Reading saved", "Sent")
 * takes focus when it mounts, so a screen reader reads it and the keyboard continues from it. Give the element
 * tabIndex={-1}. After a save that returns to another page, the page heading takes focus instead (RootLayout).
 */
export function useFocusOnArrival<T extends HTMLElement>(enabled = true) {
  const ref = useRef<T>(null);
  useEffect(() => {
    if (enabled) ref.current?.focus();
  }, [enabled]);
  return ref;
}

/** Moves focus to an element of the page by id, as a same-page link should (browsers only scroll to it). */
export function focusById(id: string): boolean {
  const target = document.getElementById(id);
  if (!target) return false;
  if (!target.hasAttribute('tabindex') && !target.matches('a[href], button, input, select, textarea')) target.tabIndex = -1;
  target.scrollIntoView?.({ block: 'start' });
  target.focus({ preventScroll: true });
  return true;
}

/**
 * For a panel that opens in place (an "Edit" that becomes a form): when it closes, after a save or a cancel, focus
 * goes back to the control that opened it instead of falling to the page body. Put the ref on that control.
 */
export function useFocusWhenClosed<T extends HTMLElement>(open: boolean) {
  const ref = useRef<T>(null);
  const wasOpen = useRef(open);
  useEffect(() => {
    if (wasOpen.current && !open) ref.current?.focus();
    wasOpen.current = open;
  }, [open]);
  return ref;
}
