import type { FormEvent } from 'react';
import { Button } from '../button';

interface SearchFormProps {
  label: string;
  /** The search in the URL now, if any. */
  value: string | undefined;
  /** Called with the trimmed text, or nothing when the box was cleared. */
  onSearch: (q: string | undefined) => void;
  /** A Tailwind width class for the box. */
  width: string;
}

/** Searches on submit, not on each key, so every search is one request and one entry in the history. */
export function SearchForm({ label, value, onSearch, width }: SearchFormProps) {
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const q = String(new FormData(event.currentTarget).get('q') ?? '').trim();
    onSearch(q || undefined);
  };
  return (
    <form role="search" onSubmit={onSubmit} className="flex flex-wrap items-end gap-2">
      <label className="flex flex-col gap-1 font-semibold">
        {label}
        {/* Keyed on the URL value so back and forward refill the box with what was searched. */}
        <input
          key={value ?? ''}
          name="q"
          type="search"
          defaultValue={value ?? ''}
          maxLength={100}
          className={`min-h-11 ${width} max-w-full rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal`}
        />
      </label>
      <Button type="submit" variant="secondary">
        Search
      </Button>
    </form>
  );
}
