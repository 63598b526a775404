import type { RecordingTrace } from '@shared/schemas/recordings';
import { EmptyState } from '../../../components/ui/empty-state';
import { secondsText } from './recording-format';
import { ScrollRegion } from '../../../components/ui/scroll-region';

const clock = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' });

function startText(startSec: number, startedAt: string | null): string {
  if (startedAt) return clock.format(new Date(Date.parse(startedAt) + startSec * 1000));
  const s = Math.round(startSec);
  return `${Math.floor(s / 3600)}:${String(Math.floor((s % 3600) / 60)).padStart(2, '0')}:${String(s % 60).padStart(2, '0')}`;
}

interface DesaturationTableProps {
  events: RecordingTrace['events'];
  startedAt: string | null;
}

/** Every event marked on the chart, as text, so nothing depends on seeing the shading. */
export function DesaturationTable({ events, startedAt }: DesaturationTableProps) {
  if (events.length === 0) return <EmptyState message="No falls in SpO2 of 3 points or more in the valid time." />;
  return (
    <ScrollRegion label="Desaturation events, in time order" className="max-h-96 overflow-auto rounded-lg border border-surface-200">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Desaturation events, in time order</caption>
        <thead className="sticky top-0 bg-surface-100 text-ink-700">
          <tr>
            <th scope="col" className="px-2 py-2 font-semibold sm:px-3">{startedAt ? 'Start' : 'Start (from the beginning)'}</th>
            <th scope="col" className="px-2 py-2 text-right font-semibold sm:px-3">Duration</th>
            <th scope="col" className="px-2 py-2 text-right font-semibold sm:px-3">Lowest SpO2</th>
            <th scope="col" className="px-2 py-2 font-semibold sm:px-3">Fall of 4 or more</th>
          </tr>
        </thead>
        <tbody>
          {events.map((event) => (
            <tr key={event.startSec} className="border-t border-surface-200">
              <td className="whitespace-nowrap px-2 py-2 sm:px-3 tabular-nums text-ink-900">{startText(event.startSec, startedAt)}</td>
              <td className="whitespace-nowrap px-2 py-2 sm:px-3 text-right tabular-nums text-ink-900">{secondsText(event.endSec - event.startSec)}</td>
              <td className="whitespace-nowrap px-2 py-2 sm:px-3 text-right tabular-nums font-semibold text-ink-900">{event.nadir} %</td>
              <td className="px-2 py-2 text-ink-900 sm:px-3">{event.deep ? 'Yes' : 'No'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
