import type { JourneyPlan } from '@shared/schemas/journeys';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { WorkingTable } from '../../../components/clinical/working-table';

/** The whole worked sheet: the journey's supply lines, then each conversion from home to there, line by line. */
export function JourneyWorking({ plan }: { plan: JourneyPlan }) {
  const working = plan.working;
  if (!working) return <p className="text-ink-700">The working is not available for this check.</p>;
  return (
    <div className="flex flex-col gap-5">
      <WorkingTable working={working.lines} warnings={plan.warnings ?? []} caption="How the journey supply was worked out" />
      <p className="text-sm text-ink-700">{working.note}</p>
      {working.conversions.map((c) => (
        <div key={c.homeFlowLpm} className="flex flex-col gap-2">
          <h3 className="font-bold text-ink-900">
            Home setting {formatFlow(c.homeFlowLpm)} L/min ({c.periods.join(', ')}): converted to there
          </h3>
          <WorkingTable
            working={c.conversion.working}
            model={c.conversion.model}
            caption={`Conversion of ${formatFlow(c.homeFlowLpm)} L/min from home to there`}
          />
        </div>
      ))}
    </div>
  );
}
