import type { Journey, JourneyPlan } from '@shared/schemas/journeys';
import { flowWords } from '../../../components/clinical/setting-text';
import { datesWords, hoursWords, PERIOD_WORDS } from './journey-words';

function FlowThere({ plan }: { plan: JourneyPlan }) {
  if (plan.exceedsCannula) {
    return (
      <p className="rounded-xl bg-brand-50 px-4 py-3 text-xl font-semibold text-ink-900">
        Your team will tell you how your baby’s oxygen will be given there.
      </p>
    );
  }
  const flows = plan.periods.map((p) => p.flowLpm);
  if (flows.every((flow) => flow === flows[0]) && flows[0] !== null) {
    return (
      <p className="rounded-xl bg-brand-50 px-4 py-4 text-3xl font-bold leading-snug text-brand-800">
        Set the flowmeter to {flowWords(flows[0])}, day and night
      </p>
    );
  }
  return (
    <>
      <p className="text-2xl font-bold text-ink-900">Set the flowmeter to:</p>
      <ul aria-label="Flow there for each part of the day" className="flex flex-col gap-2">
        {plan.periods.map((p) => (
          <li key={p.period} className="rounded-xl bg-brand-50 px-4 py-3 text-2xl text-ink-900">
            <span className="font-semibold">{PERIOD_WORDS[p.period]}:</span>{' '}
            <span className="font-bold text-brand-800">{p.flowLpm === null ? 'ask your team' : flowWords(p.flowLpm)}</span>
          </li>
        ))}
      </ul>
    </>
  );
}

function CylindersToTake({ plan }: { plan: JourneyPlan }) {
  const known = plan.cylinders.filter((c) => c.count !== null && c.count > 0);
  if (known.length === 0) return null;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-xl font-bold text-ink-900">
        Cylinders to take for {hoursWords(plan.hoursAway)} away from your home supply
        {known.length > 1 ? ' (one of these):' : ':'}
      </p>
      <ul aria-label="Cylinders to take" className="flex flex-col gap-2">
        {known.map((c) => (
          <li key={c.cylinderId} className="rounded-xl border border-surface-200 bg-surface-50 px-4 py-3 text-xl text-ink-900">
            <span className="font-bold">{c.count} × </span>
            {c.name}
          </li>
        ))}
      </ul>
      {plan.reservePercent > 0 && (
        <p className="text-lg text-ink-700">This includes {plan.reservePercent}% extra in case of delays.</p>
      )}
    </div>
  );
}

/**
 * The card shows from approval until the return, under the home plan: say when its setting applies, so no one
 * moves the flowmeter to the trip's setting at home.
 */
function whenItApplies(request: Journey['request'], plan: JourneyPlan): string {
  if (request.mode === 'road') return `While you are away at ${request.destinationName}:`;
  return plan.destination.kind === 'aircraft-cabin' ? 'On the flight:' : `On the flight and while you are in ${request.destinationName}:`;
}

/** An approved trip, for the family: the flow there and what to take, in the same plain words as the home plan. */
export function TripCard({ journey }: { journey: Journey & { plan: JourneyPlan } }) {
  const { request, plan } = journey;
  return (
    <section aria-labelledby={`trip-${journey.id}`} className="flex flex-col gap-4 rounded-2xl border-2 border-brand-600 bg-surface-0 p-5">
      <div>
        <h2 id={`trip-${journey.id}`} className="text-2xl font-bold text-ink-900">
          Your trip to {request.destinationName}
        </h2>
        <p className="mt-1 text-lg text-ink-700">
          {request.mode === 'flight' ? 'Flying' : 'By road'} {datesWords(request)}. Approved by the consultant
          {journey.decision ? ` (${journey.decision.by.name})` : ''}.
        </p>
      </div>
      <div className="flex flex-col gap-2">
        <p className="text-xl font-semibold text-ink-900">{whenItApplies(request, plan)}</p>
        <FlowThere plan={plan} />
        <p className="text-lg text-ink-700">Only for the trip: at home, keep to your usual setting.</p>
      </div>
      <CylindersToTake plan={plan} />
      <aside aria-label={`Before you go to ${request.destinationName}`} className="rounded-xl border border-straw-300 bg-straw-50 p-4 text-lg leading-relaxed text-straw-900">
        <h3 className="mb-2 text-xl font-bold">Before you go</h3>
        <ul className="flex list-disc flex-col gap-2 pl-5">
          {plan.cautions.map((caution) => (
            <li key={caution}>{caution}</li>
          ))}
        </ul>
      </aside>
    </section>
  );
}
