import type { JourneyPlan } from '@shared/schemas/journeys';
import { formatFlow, formatMmHg } from '../../../components/clinical/clinical-format';
import { Alert } from '../../../components/ui/alert';
import { hoursAndMinutesText as durationText } from '@shared/clinical/cylinder-time';
import { PERIOD_WORDS } from './journey-words';
import { ScrollRegion } from '../../../components/ui/scroll-region';

const flowCell = (flow: number | null) => (flow === null ? '—' : `${formatFlow(flow)} L/min`);
const exactCell = (flow: number | null) => (flow === null ? 'not reachable' : `${flow.toFixed(3)} L/min`);

function PeriodTable({ plan }: { plan: JourneyPlan }) {
  return (
    <ScrollRegion label="Flow there for each part of the day" className="overflow-x-auto rounded-lg border border-surface-200">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Flow there for each part of the day</caption>
        <thead className="bg-surface-100 text-ink-700">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">Part of the day</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Approved at home</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Needed there</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Setting there (rounded up)</th>
          </tr>
        </thead>
        <tbody>
          {plan.periods.map((p) => (
            <tr key={p.period} className="border-t border-surface-200 align-top">
              <th scope="row" className="px-3 py-2 font-semibold text-ink-900">{PERIOD_WORDS[p.period]}</th>
              <td className="px-3 py-2 text-right tabular-nums">{flowCell(p.homeFlowLpm)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{exactCell(p.requiredFlowLpm)}</td>
              <td className="px-3 py-2 text-right tabular-nums">
                <span className="font-bold">{p.exceedsCannula ? 'Cannot be given by cannula' : flowCell(p.flowLpm)}</span>
                {p.keptHomeFlow && <span className="block text-xs text-ink-700">home setting kept (never lowered)</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}

function CylinderTable({ plan }: { plan: JourneyPlan }) {
  if (plan.cylinders.length === 0) return <p className="text-ink-700">The programme lists no cylinders, so no supply is counted.</p>;
  return (
    <ScrollRegion label="Cylinders to take" className="overflow-x-auto rounded-lg border border-surface-200">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Cylinders to take</caption>
        <thead className="bg-surface-100 text-ink-700">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">Cylinder</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">One full cylinder lasts</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Cylinders to take</th>
          </tr>
        </thead>
        <tbody>
          {plan.cylinders.map((c) => (
            <tr key={c.cylinderId} className="border-t border-surface-200">
              <th scope="row" className="px-3 py-2 font-semibold text-ink-900">{c.name}</th>
              <td className="px-3 py-2 text-right tabular-nums">{c.minutesPerCylinder === null ? '—' : durationText(c.minutesPerCylinder)}</td>
              <td className="px-3 py-2 text-right text-lg font-bold tabular-nums">{c.count === null ? '—' : c.count}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}

/** The plan's key numbers for the consultant: the flow there per part of the day, then the supply. */
export function JourneyFigures({ plan }: { plan: JourneyPlan }) {
  const there = plan.destination.kind === 'aircraft-cabin' ? 'Aircraft cabin' : 'Destination';
  return (
    <div className="flex flex-col gap-4">
      {plan.exceedsCannula && (
        <Alert>Cannot be met by a low-flow cannula: the flow needed there is beyond the cannula or the supply. Decide how, or whether, the trip can be made.</Alert>
      )}
      <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-500">Home</dt>
        <dd className="text-ink-900">
          {plan.origin.elevationM === null ? 'measured pressure' : `${Math.round(plan.origin.elevationM)} m`}, {formatMmHg(plan.origin.pressureMmHg)} mmHg
        </dd>
        <dt className="text-ink-500">{there}</dt>
        <dd className="text-ink-900">{Math.round(plan.destination.elevationM)} m, {formatMmHg(plan.destination.pressureMmHg)} mmHg</dd>
        <dt className="text-ink-500">Air pressure model</dt>
        <dd className="text-ink-900">{plan.pressureModel.name} ({plan.pressureModel.version})</dd>
      </dl>
      <PeriodTable plan={plan} />
      <p className="text-ink-900">
        Supply counted at <span className="font-bold">{plan.supplyFlowLpm === null ? 'no plannable flow' : `${formatFlow(plan.supplyFlowLpm)} L/min`}</span>{' '}
        for {plan.hoursAway} h away, with the programme's {plan.reservePercent}% reserve.
      </p>
      <CylinderTable plan={plan} />
    </div>
  );
}
