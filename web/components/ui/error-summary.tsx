import { useEffect, useId, useLayoutEffect, useRef, useState } from 'react';
import { collectErrorItems, type ErrorItem } from './error-summary-items';

interface ErrorSummaryProps {
  /**
   * Changes on every attempt to go on: react-hook-form's `formState.submitCount`, or a form's own count of
   * "Next" presses on a step. When the attempt leaves problems on screen, the summary takes focus.
   */
  attempt: number;
  /** The save's error (a mutation's `error`): a new one means the server refused, so focus comes here again. */
  failure?: unknown;
  /** A message about the whole form (a refused save, a lost connection), shown above the list of fields. */
  problem?: string;
  title?: string;
}

const sameItems = (a: ErrorItem[], b: ErrorItem[]) =>
  a.length === b.length && a.every((item, i) => item.target === b[i].target && item.text === b[i].text);

// Field errors arrive a render or two after the attempt (validation and the server's answer are asynchronous).
const ARMED_MS = 2000;

/**
 * The one way a form reports what stops it (WCAG 3.3.1, 3.3.3): a box at the top of the form listing each problem
 * as a link to its field, focused when an attempt fails. Put it first inside the <form>. It reads the fields marked
 * aria-invalid itself (with the same words shown beside them) and follows them as they are fixed, so any form
 * built from the UI kit's fields gets it without naming its fields again.
 */
export function ErrorSummary({ attempt, failure, problem, title = 'There is a problem' }: ErrorSummaryProps) {
  const box = useRef<HTMLDivElement>(null);
  const anchor = useRef<HTMLSpanElement>(null);
  const titleId = useId();
  const [items, setItems] = useState<ErrorItem[]>([]);
  const armedUntil = useRef(0);

  // Keep the list in step with the form: fields marked or cleared, another step of a multi-step form shown.
  useLayoutEffect(() => {
    const form = anchor.current?.closest('form') ?? anchor.current?.parentElement;
    if (!form) return;
    const refresh = () => {
      const next = attempt > 0 || failure ? collectErrorItems(form) : [];
      // The summary's own rendering is a change inside the form too: an unchanged list must not render again.
      setItems((shown) => (sameItems(shown, next) ? shown : next));
    };
    refresh();
    const observer = new MutationObserver(refresh);
    observer.observe(form, { subtree: true, childList: true, attributes: true, attributeFilter: ['aria-invalid'] });
    return () => observer.disconnect();
  }, [attempt, failure]);

  useLayoutEffect(() => {
    if (attempt > 0 || failure || problem) armedUntil.current = Date.now() + ARMED_MS;
  }, [attempt, failure, problem]);

  const showing = Boolean(problem) || items.length > 0;
  useLayoutEffect(() => {
    // Focus once per failed attempt: fixing a field, or a field marked while typing, never pulls focus back up.
    if (!showing || Date.now() > armedUntil.current) return;
    armedUntil.current = 0;
    const summary = box.current;
    summary?.focus();
    // react-hook-form focuses the first invalid field itself, sometimes just after this render: the summary comes first.
    setTimeout(() => {
      const active = document.activeElement;
      if (summary?.isConnected && active?.closest('[aria-invalid="true"]')) summary.focus();
    }, 0);
  });

  useEffect(() => () => void (armedUntil.current = 0), []);

  return (
    <>
      <span ref={anchor} hidden />
      {showing && (
        <div ref={box} tabIndex={-1} role="region" aria-labelledby={titleId} data-error-summary=""
          className="scroll-mt-4 rounded-lg border-2 border-danger-600 bg-danger-50 px-4 py-3 text-danger-800">
          <h2 id={titleId} className="text-lg font-bold">{title}</h2>
          {problem && <p className="mt-1 font-semibold">{problem}</p>}
          {items.length > 0 && (
            <ul className="mt-2 flex list-disc flex-col gap-1 pl-5">
              {items.map((item) => (
                <li key={item.key}>
                  <a href={item.target.id ? `#${item.target.id}` : '#'} className="font-semibold underline"
                    onClick={(event) => {
                      event.preventDefault();
                      item.target.scrollIntoView?.({ block: 'center' });
                      item.target.focus();
                    }}>
                    {item.text}
                  </a>
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </>
  );
}
