import { Button } from '../button';
import { PageSizeSelect } from './page-size-select';

interface CursorPagerProps {
  page: number;
  pageSize: number;
  total: number;
  /** The total is PostgreSQL's estimate (a very large list): shown as "about". */
  estimate?: boolean;
  nextCursor?: string | null;
  prevCursor?: string | null;
  noun: { one: string; other: string };
  /** Turn a page: the cursor of the row beside it, which way, and the page number to show. */
  onPage: (to: { cursor: string | undefined; direction: 'next' | 'prev'; page: number }) => void;
  onPageSize: (size: number) => void;
}

/**
 * Previous and next by position: each page is "the rows after (or before) this one", so turning a page costs the
 * same on the 2nd page as on the 2,000th. The page number is kept for the reader; a first page needs no cursor.
 */
export function CursorPager({ page, pageSize, total, estimate, nextCursor, prevCursor, noun, onPage, onPageSize }: CursorPagerProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const about = estimate ? 'about ' : '';
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
      <p className="text-ink-700">
        Page {page} of {about}{pages.toLocaleString('en-GB')} · {about}{total.toLocaleString('en-GB')} {total === 1 && !estimate ? noun.one : noun.other}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <PageSizeSelect value={pageSize} onChange={onPageSize} />
        <Button
          variant="secondary"
          size="sm"
          disabled={!prevCursor}
          // Back to page 1 is the plain first page, so its link is the short one everybody shares.
          onClick={() => onPage(page <= 2 ? { cursor: undefined, direction: 'next', page: 1 } : { cursor: prevCursor ?? undefined, direction: 'prev', page: page - 1 })}
        >
          Previous page
        </Button>
        <Button variant="secondary" size="sm" disabled={!nextCursor} onClick={() => onPage({ cursor: nextCursor ?? undefined, direction: 'next', page: page + 1 })}>
          Next page
        </Button>
      </div>
    </nav>
  );
}
