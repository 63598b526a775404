import { asksForNoOxygen } from '@shared/equipment/concentrator-fit';
import type { Prescription } from '@shared/schemas/prescriptions';
import { flowWords, settingText } from '../../../components/clinical/setting-text';

const PERIOD_WORDS = { awake: 'When awake', asleep: 'When asleep', feeding: 'When feeding' } as const;
const SOURCE_WORDS: Record<string, string> = {
  concentrator: 'from your oxygen concentrator',
  cylinder: 'from a cylinder',
};

const differsByPeriod = (flowLpm: number, periods: Prescription['periods']) =>
  !!periods && (Object.keys(PERIOD_WORDS) as (keyof typeof PERIOD_WORDS)[]).some((p) => periods[p] !== flowLpm);

/** The flowmeter setting as a parent would say it, big enough to read from across the room. */
export function PlanWords({ flowLpm, periods, source }: { flowLpm: number; periods: Prescription['periods']; source: string }) {
  const sourceWords = SOURCE_WORDS[source];
  if (asksForNoOxygen(flowLpm, periods)) {
    // The last step down: nothing to set and nothing flowing, so no flowmeter setting and no source are named.
    return <p className="rounded-xl bg-brand-50 px-4 py-4 text-3xl font-bold leading-snug text-brand-800">No oxygen: the flowmeter stays off, day and night.</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      {periods && differsByPeriod(flowLpm, periods) ? (
        <>
          <p className="text-2xl font-bold text-ink-900">Set the flowmeter to:</p>
          <ul aria-label="Flow for each part of the day" className="flex flex-col gap-2">
            {(Object.keys(PERIOD_WORDS) as (keyof typeof PERIOD_WORDS)[]).map((period) => (
              <li key={period} className="rounded-xl bg-brand-50 px-4 py-3 text-2xl text-ink-900">
                <span className="font-semibold">{PERIOD_WORDS[period]}:</span>{' '}
                <span className="font-bold text-brand-800">{flowWords(periods[period])}</span>
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="rounded-xl bg-brand-50 px-4 py-4 text-3xl font-bold leading-snug text-brand-800">
          Set the flowmeter to {settingText({ flowLpm, periods })}
        </p>
      )}
      {sourceWords && <p className="text-xl text-ink-900">The oxygen comes {sourceWords}.</p>}
    </div>
  );
}
