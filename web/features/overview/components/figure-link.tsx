import { Children, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { InPageLink } from '../../../components/ui/in-page-link';

interface FigureLinkProps {
  to: string;
  count: number;
  /** Words after the number, so the link reads as one sentence: "3 checks overdue". */
  label: string;
  /** A second line in smaller type: how old the oldest is, how many babies. */
  detail?: ReactNode;
  /** A figure that asks for action while above zero gets a coloured edge; the words already say so. */
  attention?: boolean;
}

/** One figure of a start page: a large number with its words, the whole tile a link to the list behind it. */
export function FigureLink({ to, count, label, detail, attention = false }: FigureLinkProps) {
  const edge = attention && count > 0 ? 'border-l-warn-600' : 'border-l-brand-200';
  const className = `group flex min-h-28 flex-col justify-between gap-1 rounded-2xl border border-l-8 border-surface-200 ${edge} bg-surface-0 p-4 shadow-sm hover:bg-brand-50`;
  const content = (
    <>
      <span className="flex flex-wrap items-baseline gap-x-2">
        <span className="text-4xl font-bold tabular-nums text-ink-900 sm:text-5xl">{count}</span>{' '}
        <span className="text-lg font-semibold text-brand-800 underline decoration-brand-300 underline-offset-4 group-hover:decoration-brand-700">{label}</span>
      </span>
      {detail && <>{' '}<span className="text-ink-700">{detail}</span></>}
    </>
  );
  // A list further down the same page is reached by an in-page link, which moves focus there too.
  return to.startsWith('#')
    ? <InPageLink target={to.slice(1)} className={className}>{content}</InPageLink>
    : <Link to={to} className={className}>{content}</Link>;
}

/** Figures side by side on a wide screen, two to a row on a phone. */
export function FigureGrid({ label, children }: { label: string; children: ReactNode }) {
  return (
    <ul aria-label={label} className="grid grid-cols-2 gap-3 lg:grid-cols-4">
      {Children.toArray(children).map((child, i) => <li key={i} className="flex flex-col [&>a]:flex-1">{child}</li>)}
    </ul>
  );
}
