import { Link } from 'react-router-dom';
import { JOURNEY_STATUS_LABELS } from '@shared/schemas/journeys';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useInfantJourneys } from '../api/get-journeys';
import { STATUS_TONES } from './journey-request-facts';
import { shortDayWords, wayWords } from './journey-words';

interface JourneysSectionProps {
  infantId: string;
  /** The coordinator arranges trips; others only follow them. */
  canRequest: boolean;
}

/** The baby's journey checks on the record, newest first, each opening its plan and working. */
export function JourneysSection({ infantId, canRequest }: JourneysSectionProps) {
  const journeys = useInfantJourneys(infantId);
  const action = canRequest ? (
    <Link to={`/infants/${infantId}/journeys/new`} className="inline-flex min-h-9 items-center rounded-lg bg-brand-600 px-3 text-sm font-semibold text-white hover:bg-brand-700">
      New journey check
    </Link>
  ) : undefined;
  return (
    <Card title="Journeys" actions={action}>
      {journeys.isPending ? (
        <Spinner label="Loading journeys" />
      ) : journeys.isError ? (
        <Alert>{errorMessage(journeys.error)}</Alert>
      ) : journeys.data.length === 0 ? (
        <EmptyState message="No journey checks yet." />
      ) : (
        <ul aria-label="Journey checks" className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
          {journeys.data.map((j) => (
            <li key={j.id} className="flex flex-col gap-1 px-3 py-2">
              <div className="flex flex-wrap items-center gap-2">
                <Link to={`/journeys/${j.id}`} className="font-semibold text-brand-800 underline">
                  {j.request.destinationName}
                </Link>
                <Badge tone={STATUS_TONES[j.status]}>{JOURNEY_STATUS_LABELS[j.status]}</Badge>
                {j.plan?.exceedsCannula && <Badge tone="danger">Cannot be met by cannula</Badge>}
              </div>
              <p className="text-sm text-ink-700">
                {shortDayWords(j.request.departOn)} to {shortDayWords(j.request.returnOn)} · {wayWords(j.request)}
                {j.plan?.supplyFlowLpm != null && <> · up to {formatFlow(j.plan.supplyFlowLpm)} L/min there</>}
              </p>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
