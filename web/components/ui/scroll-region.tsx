import { useEffect, useRef, useState, type ReactNode } from 'react';

interface ScrollRegionProps {
  /** What scrolls, e.g. the table's caption: read out when the region takes focus. */
  label: string;
  className?: string;
  children: ReactNode;
}

/**
 * A box that scrolls sideways (or down) when its content is wider than the screen, as a wide table is at 200 %
 * zoom or on a phone. While it overflows it is a named region in the Tab order, so a keyboard can scroll it with the
 * arrow keys (WCAG 2.1.1, axe scrollable-region-focusable); when everything fits it is a plain box.
 */
export function ScrollRegion({ label, className = 'overflow-x-auto', children }: ScrollRegionProps) {
  const box = useRef<HTMLDivElement>(null);
  const [overflows, setOverflows] = useState(false);
  useEffect(() => {
    const element = box.current;
    if (!element) return;
    const measure = () =>
      setOverflows(element.scrollWidth > element.clientWidth + 1 || element.scrollHeight > element.clientHeight + 1);
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    if (element.firstElementChild) observer.observe(element.firstElementChild);
    return () => observer.disconnect();
  }, []);
  return (
    <div ref={box} className={className} {...(overflows ? { tabIndex: 0, role: 'region', 'aria-label': label } : {})}>
      {children}
    </div>
  );
}
