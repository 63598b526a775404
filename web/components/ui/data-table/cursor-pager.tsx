import { Button } from '../button';
import { PageSizeSelect } from './page-size-select';
import { numberInWords } from '@shared/format/number-words';

/** What a list answer says about its pages (the same fields on every list that pages by position). */
export interface CursorPage {
  total: number;
  /** The total is PostgreSQL's estimate (a very large list): shown as "about". */
  totalIsEstimate?: boolean;
  nextCursor?: string | null;
  prevCursor?: string | null;
}

/** A change the pager asks of the list view: a page turned (the cursor of the row beside it, which way, the page number to show) or a new page size. */
export type CursorPagerChange = { cursor: string | undefined; direction: 'next' | 'prev'; page: number } | { pageSize: number };

interface CursorPagerProps {
  view: { page: number; pageSize: number };
  result: CursorPage;
  noun: { one: string; other: string };
  onChange: (change: CursorPagerChange) => void;
}

/**
 * Previous and next by position: each page is "the rows after (or before) this one", so turning a page costs the
 * same on the 2nd page as on the 2,000th. The page number is kept for the reader; a first page needs no cursor.
 */
export function CursorPager({ view: { page, pageSize }, result: { total, totalIsEstimate: estimate, nextCursor, prevCursor }, noun, onChange }: CursorPagerProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const about = estimate ? 'about ' : '';
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
      <p className="text-ink-700">
        Page {page} of {about}{numberInWords(pages)} · {about}{numberInWords(total)} {total === 1 && !estimate ? noun.one : noun.other}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <PageSizeSelect value={pageSize} onChange={(size) => onChange({ pageSize: size })} />
        <Button
          variant="secondary"
          size="sm"
          disabled={!prevCursor}
          // Back to page 1 is the plain first page, so its link is the short one everybody shares.
          onClick={() => onChange(page <= 2 ? { cursor: undefined, direction: 'next', page: 1 } : { cursor: prevCursor ?? undefined, direction: 'prev', page: page - 1 })}
        >
          Previous page
        </Button>
        <Button variant="secondary" size="sm" disabled={!nextCursor} onClick={() => onChange({ cursor: nextCursor ?? undefined, direction: 'next', page: page + 1 })}>
          Next page
        </Button>
      </div>
    </nav>
  );
}
