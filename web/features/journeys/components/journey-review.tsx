import { Link } from 'react-router-dom';
import type { Journey } from '@shared/schemas/journeys';
import { Cautions } from '../../../components/clinical/cautions';
import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { isApiError } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import type { useDecideJourney } from '../api/decide-journey';
import { JourneyDecisionForm } from './journey-decision-form';
import { JourneyFigures } from './journey-figures';
import { JourneyRequestFacts } from './journey-request-facts';
import { JourneyWorking } from './journey-working';

export const JOURNEY_ALREADY_DECIDED = 'Someone has already decided this journey check, or it changed meanwhile. The page now shows it as it is.';

function Outcome({ journey }: { journey: Journey }) {
  const d = journey.decision;
  if (!d) return <p className="text-ink-700">Waiting for a consultant’s decision.</p>;
  return (
    <div className="flex flex-col gap-1">
      <p className="text-ink-900">
        {d.outcome === 'approved' ? 'Approved' : 'Not approved'} by {d.by.name || 'a consultant'} on {formatDateTime(d.at)}.
      </p>
      {d.reason && <p className="text-ink-700">Reason: {d.reason}</p>}
    </div>
  );
}

interface JourneyReviewProps {
  journey: Journey;
  canDecide: boolean;
  mutation: ReturnType<typeof useDecideJourney>;
  onDecided: () => void;
}

export function JourneyReview({ journey, canDecide, mutation, onDecided }: JourneyReviewProps) {
  const { plan } = journey;
  const conflict = isApiError(mutation.error) && mutation.error.status === 409;
  const waiting = journey.status === 'waiting';
  return (
    <div className="flex flex-col gap-4">
      <JourneyRequestFacts journey={journey} />
      {plan ? (
        <>
          <Card title={waiting ? 'Proposed journey plan' : 'Journey plan'}>
            {waiting && (
              <p className="mb-3 rounded-lg border-2 border-dashed border-warn-600 bg-warn-50 px-3 py-2 font-bold text-warn-800">
                PROPOSAL — not approved. The family sees the numbers only after a consultant approves them.
              </p>
            )}
            <JourneyFigures plan={plan} />
          </Card>
          <Card title="Cautions for this journey">
            <ul aria-label="Cautions for this journey" className="flex list-disc flex-col gap-1 pl-5 text-ink-900">
              {plan.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </Card>
          <Card title="Checks and working">
            <JourneyWorking plan={plan} />
          </Card>
        </>
      ) : (
        <Alert tone="warn">No plan could be worked out for this request.</Alert>
      )}
      <Cautions variant="staff" />
      <Card title="Decision">
        <div id="decision" className="flex scroll-mt-4 flex-col gap-4">
          {conflict && <Alert>{`${JOURNEY_ALREADY_DECIDED} ${mutation.error?.message ?? ''}`.trim()}</Alert>}
          {waiting && canDecide ? <JourneyDecisionForm key={journey.rowVersion} journey={journey} mutation={mutation} onDecided={onDecided} /> : <Outcome journey={journey} />}
          <Link to={`/infants/${journey.infantId}`} className="font-semibold text-brand-700 underline">
            Open {journey.infantName}’s record
          </Link>
        </div>
      </Card>
    </div>
  );
}
