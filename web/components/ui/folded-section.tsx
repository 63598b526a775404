import { useId, useState, type ReactNode } from 'react';

interface FoldedSectionProps {
  title: string;
  /** Heading level in the page outline (cards are h2, parts of a card h3). */
  headingLevel?: 2 | 3;
  /** A short line under the title saying what is inside, shown while folded. */
  summary?: string;
  defaultOpen?: boolean;
  /** Large type for the family pages. */
  large?: boolean;
  tone?: 'plain' | 'danger';
  children: ReactNode;
}

/**
 * A part of a long page folded under its heading: the heading holds a button that says whether it is open
 * (aria-expanded), so the outline and the heading list of a screen reader stay whole while the page stays short.
 */
export function FoldedSection({ title, headingLevel = 2, summary, defaultOpen = false, large = false, tone = 'plain', children }: FoldedSectionProps) {
  const [open, setOpen] = useState(defaultOpen);
  const id = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const frame = tone === 'danger' ? '' : 'rounded-2xl border border-surface-200 bg-surface-0 shadow-sm';
  return (
    <section className={frame}>
      <Heading className={`font-bold ${large ? 'text-xl' : 'text-lg'} text-ink-900`}>
        <button
          type="button"
          aria-expanded={open}
          aria-controls={`${id}-body`}
          onClick={() => setOpen((was) => !was)}
          className={`flex w-full items-center justify-between gap-3 rounded-2xl text-left ${tone === 'danger' ? 'min-h-11 py-1' : 'min-h-13 p-4 sm:px-6'} hover:bg-surface-50`}
        >
          <span className="flex flex-col">
            <span>{title}</span>
            {summary && !open && <span className={`font-normal text-ink-700 ${large ? 'text-lg' : 'text-base'}`}>{summary}</span>}
          </span>
          <svg viewBox="0 0 20 20" aria-hidden="true" className={`size-6 shrink-0 transition-transform ${open ? 'rotate-180' : ''}`} fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round">
            <path d="M5 7.5l5 5 5-5" />
          </svg>
        </button>
      </Heading>
      <div id={`${id}-body`} hidden={!open} className={tone === 'danger' ? 'pt-2' : 'px-4 pb-4 sm:px-6 sm:pb-6'}>
        {children}
      </div>
    </section>
  );
}
