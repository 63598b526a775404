import type { Prescription } from '@shared/schemas/prescriptions';
import { CarePlanLink } from '../../../components/clinical/care-plan-link';
import { Cautions } from '../../../components/clinical/cautions';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { formatDay } from '../../../lib/format';
import { PlanWords } from './plan-words';


export const NO_PLAN_YET = "Your baby's home oxygen plan will show here once the consultant has approved it.";

/** Only an approved plan ever reaches this card: a proposal or its working is never shown to a family. */
export function PlanCard({ plan }: { plan: Prescription | null }) {
  if (!plan || plan.approvedFlowLpm === null) {
    return (
      <Card title="Home oxygen plan">
        <EmptyState large message={NO_PLAN_YET} />
      </Card>
    );
  }
  return (
    <Card title="Home oxygen plan">
      <div className="flex flex-col gap-4">
        <PlanWords flowLpm={plan.approvedFlowLpm} periods={plan.periods} source={plan.source} />
        {plan.decidedAt && (
          <p className="text-lg text-ink-700">
            Approved{plan.decidedBy?.name ? ` by ${plan.decidedBy.name}` : ''} on {formatDay(plan.decidedAt)}.
          </p>
        )}
        <div>
          <CarePlanLink infantId={plan.infantId} />
        </div>
        <Cautions variant="family" />
      </div>
    </Card>
  );
}
