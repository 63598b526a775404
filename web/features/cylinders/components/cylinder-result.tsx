import { useEffect, useRef } from 'react';
import { cylinderTime } from '@shared/clinical/cylinder-time';
import type { CylinderType } from '@shared/schemas/policy';
import { flowWords } from '../../../components/clinical/setting-text';
import { clockAfter, durationWords } from './duration-words';
import type { FlowGroup } from './flow-groups';

interface CylinderResultProps {
  cylinder: CylinderType;
  gauge: number;
  flows: readonly FlowGroup[];
  reservePercent: number;
  now: Date;
}

function FlowResult({ cylinder, gauge, flow, reservePercent, now }: Omit<CylinderResultProps, 'flows'> & { flow: FlowGroup }) {
  const time = cylinderTime({ cylinder, gauge, flowLpm: flow.flowLpm, reservePercent });
  const total = time.minutesTotal ?? 0;
  const before = time.minutesBeforeReserve ?? 0;
  const changeAt = `${cylinder.residualPressure} ${cylinder.unit}`;
  return (
    <li className="flex flex-col gap-2 rounded-xl border-2 border-brand-200 bg-brand-50 p-4">
      <p className="text-lg text-ink-700">
        At {flowWords(flow.flowLpm)} ({flow.when}):
      </p>
      {total <= 0 ? (
        <p className="text-2xl font-bold text-danger-800">This cylinder is at its change-over mark ({changeAt}). Change it now.</p>
      ) : (
        <>
          <p className="text-2xl font-bold text-ink-900">
            Lasts about {durationWords(total)}, until the gauge reads {changeAt}.
          </p>
          <p className="text-xl font-semibold text-brand-800">
            Change it or plan a refill before {durationWords(before)} from now (about {clockAfter(before, now)}).
          </p>
          {reservePercent > 0 && (
            <p className="text-lg text-ink-700">
              That keeps {durationWords(total - before)} in hand: the programme plans {reservePercent}% extra as a reserve.
            </p>
          )}
        </>
      )}
    </li>
  );
}

/** The time left for each flow the approved setting uses; durations are rounded down, never up. */
export function CylinderResult({ cylinder, gauge, flows, reservePercent, now }: CylinderResultProps) {
  const section = useRef<HTMLElement>(null);
  // On a phone the answer lands below the button, out of sight: each new answer takes focus, which brings it into
  // view and has a screen reader read it.
  useEffect(() => {
    section.current?.focus();
  }, [now]);
  return (
    <section ref={section} tabIndex={-1} aria-labelledby="cylinder-result-heading" className="flex scroll-mt-4 flex-col gap-3">
      <h2 id="cylinder-result-heading" className="text-2xl font-bold text-ink-900">
        {cylinder.name} at {gauge} {cylinder.unit}
      </h2>
      <ul aria-label="How long it lasts" className="flex flex-col gap-3">
        {flows.map((flow) => (
          <FlowResult key={flow.flowLpm} cylinder={cylinder} gauge={gauge} flow={flow} reservePercent={reservePercent} now={now} />
        ))}
      </ul>
      <p className="text-lg leading-relaxed text-ink-700">
        This is a guide worked out from the gauge reading, not a promise: gauges are not exact, and a cylinder can run
        down faster than expected. Always keep a spare ready, and check with your team if you are unsure.
      </p>
    </section>
  );
}
