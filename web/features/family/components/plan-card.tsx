import type { Prescription } from '../../../../shared/schemas/prescriptions';
import { CarePlanLink } from '../../../components/clinical/care-plan-link';
import { Cautions } from '../../../components/clinical/cautions';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { PlanWords } from './plan-words';

const longDate = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });

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
            Approved{plan.decidedBy?.name ? ` by ${plan.decidedBy.name}` : ''} on {longDate.format(new Date(plan.decidedAt))}.
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
