import type { ReactTable, RowData } from '@tanstack/react-table';
import { SortHeader } from './sort-header';
import type { ServerTableFeatures } from './use-server-table';
import { ScrollRegion } from '../scroll-region';

interface TableFrameProps<TData extends RowData> {
  table: ReactTable<ServerTableFeatures, TData>;
  /** Read out before the rows, so a screen-reader user hears what the table holds and how much. */
  caption: string;
  /** A Tailwind `min-w-[…]` class: below it the table scrolls sideways instead of squeezing its columns. */
  minWidth: string;
  /** True while the previous page stays on screen and the next one loads. */
  busy: boolean;
  /** Narrower cell padding, for tables with many columns. */
  compact?: boolean;
  /** Keeps the first column in view while the rest scrolls sideways on a phone. */
  stickyFirstColumn?: boolean;
}

const classes = (...names: (string | false | undefined)[]) => names.filter(Boolean).join(' ');

// The sticky cells need an opaque background, or the scrolled columns show through them.
const STICKY = 'sticky left-0 z-10';

export function TableFrame<TData extends RowData>({ table, caption, minWidth, busy, compact, stickyFirstColumn }: TableFrameProps<TData>) {
  const padX = compact ? 'px-2' : 'px-3';
  const sticky = (index: number) => Boolean(stickyFirstColumn) && index === 0;
  return (
    <ScrollRegion label={caption} className="relative overflow-x-auto rounded-xl border border-surface-200">
      <table className={`w-full ${minWidth} border-collapse text-left`}>
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-surface-100 text-sm text-ink-700">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header, index) => (
                <SortHeader
                  key={header.id}
                  header={header}
                  className={classes(padX, 'py-2 font-semibold', sticky(index) && `${STICKY} bg-surface-100`)}
                >
                  <table.FlexRender header={header} />
                </SortHeader>
              ))}
            </tr>
          ))}
        </thead>
        <tbody aria-busy={busy || undefined} className={stickyFirstColumn ? 'bg-surface-0' : undefined}>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={classes('border-t border-surface-200', stickyFirstColumn && 'bg-surface-0', 'align-middle')}>
              {row.getAllCells().map((cell, index) => (
                <td key={cell.id} className={classes(padX, 'py-3', sticky(index) && `${STICKY} max-w-40 bg-surface-0`)}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
