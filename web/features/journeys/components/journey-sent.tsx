import { useFocusOnArrival } from '../../../components/ui/focus';
import type { ReactNode } from 'react';
import type { Journey } from '@shared/schemas/journeys';
import { datesWords, wayWords } from './journey-words';

/** After sending: nothing is planned until the consultant has looked at it, and the page says so. */
export function JourneySent({ journey, children }: { journey: Journey; children?: ReactNode }) {
  // Focus comes here after sending, so the confirmation is read and the next link is one Tab away.
  const panel = useFocusOnArrival<HTMLElement>();
  return (
    <section ref={panel} tabIndex={-1} aria-labelledby="journey-sent" className="flex scroll-mt-4 flex-col gap-3 rounded-2xl border-2 border-brand-600 bg-brand-50 p-5">
      <h2 id="journey-sent" className="text-2xl font-bold text-brand-800">
        Sent: waiting for the consultant
      </h2>
      <p className="text-xl leading-relaxed text-ink-900">
        The trip to {journey.request.destinationName} {datesWords(journey.request)} ({wayWords(journey.request).toLowerCase()}) is
        waiting for the consultant to check it. The flow for the trip and the cylinders to take will show once the
        consultant has approved them.
      </p>
      <p className="text-lg text-ink-700">Until then, keep to your usual plan, and ask your home-care team if the trip is soon.</p>
      {children}
    </section>
  );
}
