import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { READING_STATE_LABELS, type Reading } from '@shared/schemas/readings';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { DownloadLink } from '../../../components/ui/download-link';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useInfantReadings } from '../api/get-readings';
import { ScrollRegion } from '../../../components/ui/scroll-region';

const SHOWN = 10;

interface ReadingsSectionProps {
  infantId: string;
  canLog: boolean;
  /** Lowest SpO2 of the target band; a reading under it says so in words. */
  bandMin: number | undefined;
  /** The chart, drawn by the page from the same readings (charts are another feature). */
  chart: (readings: Reading[]) => ReactNode;
}

const shortDateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });

// Three two-line columns, so the table fits a phone without sideways scrolling.
function ReadingsTable({ readings, bandMin }: { readings: Reading[]; bandMin: number | undefined }) {
  return (
    <ScrollRegion label="Latest readings, newest first" className="overflow-x-auto rounded-lg border border-surface-200">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Latest readings, newest first</caption>
        <thead className="bg-surface-100 text-ink-700">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">Taken, by</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">SpO2, pulse</th>
            <th scope="col" className="px-3 py-2 font-semibold">State, flow</th>
          </tr>
        </thead>
        <tbody>
          {readings.map((r) => (
            <tr key={r.id} className="border-t border-surface-200 align-top">
              <td className="px-3 py-2">
                <span className="block whitespace-nowrap text-ink-900">{shortDateTime.format(new Date(r.takenAt))}</span>
                <span className="block text-ink-700">{r.createdBy.name}</span>
                {r.familyReported && <Badge tone="brand">Family-reported</Badge>}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">
                <span className="block font-bold text-ink-900">{r.spo2} %</span>
                {bandMin !== undefined && r.spo2 < bandMin && <span className="block text-xs font-semibold text-warn-800">below {bandMin} %</span>}
                <span className="block text-ink-700">{r.pulse === null ? 'no pulse' : `${r.pulse} /min`}</span>
              </td>
              <td className="px-3 py-2">
                <span className="block text-ink-900">{READING_STATE_LABELS[r.state]}</span>
                <span className="block whitespace-nowrap text-ink-700">{r.flowLpm === null ? 'flow not given' : `${formatFlow(r.flowLpm)} L/min`}</span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}

export function ReadingsSection({ infantId, canLog, bandMin, chart }: ReadingsSectionProps) {
  const readings = useInfantReadings(infantId);
  const items = readings.data?.items ?? [];
  const latest = [...items].reverse().slice(0, SHOWN);
  const actions = (
    <div className="flex flex-wrap gap-2">
      {items.length > 0 && <DownloadLink href={`/api/infants/${encodeURIComponent(infantId)}/readings.csv`} label="Download CSV (all readings)" />}
      {canLog && <Link to={`/infants/${infantId}/reading`} className={buttonClasses('secondary', 'sm')}>Log a reading</Link>}
    </div>
  );
  return (
    <Card title="Readings" actions={actions}>
      {readings.isPending && <Spinner label="Loading readings" />}
      {readings.isError && <Alert>{readings.error.message}</Alert>}
      {readings.data && items.length === 0 && <EmptyState message="No readings yet." />}
      {items.length > 0 && (
        <div className="flex flex-col gap-4">
          {items.length > 1 && chart(items)}
          <div className="flex flex-col gap-1">
            <h3 className="font-semibold text-ink-900">
              {items.length > SHOWN ? `Last ${SHOWN} of ${items.length} readings` : 'Readings'}
            </h3>
            <ReadingsTable readings={latest} bandMin={bandMin} />
          </div>
        </div>
      )}
    </Card>
  );
}
