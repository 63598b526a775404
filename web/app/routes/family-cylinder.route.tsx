import { Link, useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { FamilyPageHeader } from '../../components/ui/page-header';
import { Spinner } from '../../components/ui/spinner';
import { CylinderTime } from '../../features/cylinders/components/cylinder-time';
import { useOurBabies } from '../../features/family/api/get-our-babies';
import { useOurPlan } from '../../features/family/api/get-our-plan';
import { errorMessage } from '../../lib/api-error';
import { usePageTitle } from '../../lib/page-title';

/** The family's cylinder check, at their baby's approved flow only. */
export function Component() {
  const [params] = useSearchParams();
  const babies = useOurBabies();
  const baby = babies.data?.find((b) => b.id === params.get('baby')) ?? babies.data?.[0];
  const plan = useOurPlan(baby?.id ?? '');
  const back = baby ? `/family?baby=${baby.id}` : '/family';
  const failed = babies.error ?? plan.error;
  usePageTitle('Cylinder time', baby?.name);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <Link to={back} className="self-start text-lg font-semibold text-brand-700 underline">
        ← Back to our plan
      </Link>
      <FamilyPageHeader title="How long will the cylinder last?"
        intro={`${baby ? `At ${baby.name}'s flow. ` : ''}Choose the cylinder and type in what its gauge reads.`} />
      {failed ? (
        <Alert>{errorMessage(failed)}</Alert>
      ) : babies.isPending || (baby && plan.isPending) ? (
        <Spinner label="Loading your plan" />
      ) : (
        <CylinderTime
          variant="family"
          setting={plan.data && plan.data.approvedFlowLpm !== null ? { flowLpm: plan.data.approvedFlowLpm, periods: plan.data.periods } : null}
        />
      )}
    </div>
  );
}
