import type { SortingState } from '@tanstack/react-table';

/** `-name` in the URL is `[{ id: 'name', desc: true }]` in the table, and back again. */
export interface UrlSort<TSort extends string> {
  toSorting: (sort: TSort) => SortingState;
  toSort: (sorting: SortingState, fallback: TSort) => TSort;
}

/**
 * `sorts` is every sort the server accepts; `columns` the column ids a header can sort by. A sort with no
 * column of its own (a default by date, say) shows every header unsorted rather than a wrong arrow.
 */
export function urlSort<TSort extends string>(sorts: readonly TSort[], columns: readonly string[]): UrlSort<TSort> {
  const sortable = new Set(columns);
  const known = new Set<string>(sorts);
  return {
    toSorting(sort) {
      const id = sort.replace(/^-/, '');
      return sortable.has(id) ? [{ id, desc: sort.startsWith('-') }] : [];
    },
    toSort(sorting, fallback) {
      const first = sorting[0];
      if (!first) return fallback;
      const candidate = `${first.desc ? '-' : ''}${first.id}`;
      return known.has(candidate) ? (candidate as TSort) : fallback;
    },
  };
}
