import { useEffect, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';

/** How long typing must pause before the log is searched. */
export const SEARCH_PAUSE_MS = 350;

interface MessageSearchProps {
  /** The search in the URL now, if any. */
  value: string | undefined;
  /** Called with the trimmed text, or nothing when the box was cleared; `typing` when it follows a pause in typing. */
  onSearch: (q: string | undefined, typing: boolean) => void;
}

/**
 * Searches the log by baby, recipient or number as the coordinator types (after a short pause, so one search is
 * one request), or at once on Enter or the button.
 */
export function MessageSearch({ value, onSearch }: MessageSearchProps) {
  const [text, setText] = useState(value ?? '');
  // The search in the URL: ours once the pause is over, or another after Back and Forward, which the box follows.
  const [inUrl, setInUrl] = useState(value ?? '');
  if ((value ?? '') !== inUrl) {
    setInUrl(value ?? '');
    if (text.trim() !== (value ?? '')) setText(value ?? '');
  }
  useEffect(() => {
    const q = text.trim();
    if (q === inUrl) return;
    const timer = setTimeout(() => onSearch(q || undefined, true), SEARCH_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [text, inUrl, onSearch]);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const q = text.trim();
    onSearch(q || undefined, false);
  };
  return (
    <form role="search" onSubmit={onSubmit} className="flex flex-wrap items-end gap-2">
      <label className="flex flex-col gap-1 font-semibold">
        Search by baby, name or number
        <input
          name="q"
          type="search"
          value={text}
          onChange={(event) => setText(event.target.value)}
          maxLength={100}
          className="min-h-11 w-72 max-w-full rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal"
        />
      </label>
      <Button type="submit" variant="secondary">Search</Button>
    </form>
  );
}
