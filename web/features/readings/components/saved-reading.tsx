import { useFocusOnArrival } from '../../../components/ui/focus';
import { useState } from 'react';
import type { Reading } from '@shared/schemas/readings';
import { Button } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useReading } from '../api/get-reading';
import { useStillBefore } from '../hooks/use-still-before';
import { CorrectReadingForm } from './correct-reading-form';
import { formatDayAndTime, formatTime, readingFigures } from './reading-values';

interface SavedReadingProps {
  infantId: string;
  readingId: string;
  /** Whose reading it is, when the page around it does not already say. */
  infantName?: string;
  onDismiss?: () => void;
}

/** A reading just saved, with a way to correct it while the programme's correction window is open. */
export function SavedReading({ infantId, readingId, infantName, onDismiss }: SavedReadingProps) {
  const query = useReading(infantId, readingId);
  if (query.isPending) return <Spinner label="Loading the reading" />;
  if (query.isError) return <p className="text-ink-700">{query.error.message}</p>;
  return <SavedReadingView reading={query.data} title={infantName ? `Saved for ${infantName}` : 'Reading saved'} onDismiss={onDismiss} />;
}

function SavedReadingView({ reading, title, onDismiss }: { reading: Reading; title: string; onDismiss?: () => void }) {
  const user = useSignedInUser();
  const [correcting, setCorrecting] = useState(false);
  // Only the author may correct, and only inside the window; the server holds the same two rules.
  const open = useStillBefore(reading.createdBy.id === user.id ? reading.editableUntil : null);
  // The save is confirmed where focus goes: a screen reader reads this panel, and Tab continues from it.
  const panel = useFocusOnArrival<HTMLElement>();

  return (
    <article ref={panel} tabIndex={-1} aria-label={title} className="flex scroll-mt-4 flex-col gap-3 rounded-xl border border-ok-200 bg-ok-50 p-4">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 className="font-bold text-ok-800">
            <span aria-hidden="true">✓ </span>
            {title}
          </h2>
          <p className="text-sm text-ink-700">Taken {formatDayAndTime(reading.takenAt)}</p>
        </div>
        {onDismiss && !correcting && (
          <Button variant="quiet" onClick={onDismiss} aria-label={`Hide: ${title}`}>
            Hide
          </Button>
        )}
      </div>
      <p className="text-lg text-ink-900">{readingFigures(reading).join(' · ')}</p>
      {reading.notes && <p className="text-ink-700">{reading.notes}</p>}
      {open && !correcting && reading.editableUntil && (
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" onClick={() => setCorrecting(true)}>
            Correct
          </Button>
          <span className="text-sm text-ink-700">You can correct it until {formatTime(reading.editableUntil)}</span>
        </div>
      )}
      {correcting && (
        // Kept open even if the window closes meanwhile: the server then says so and nothing typed is lost.
        <div className="rounded-xl bg-surface-0 p-3">
          <CorrectReadingForm reading={reading} onDone={() => setCorrecting(false)} />
        </div>
      )}
    </article>
  );
}
