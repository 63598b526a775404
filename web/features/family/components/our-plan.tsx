import { useSearchParams } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useOurBabies } from '../api/get-our-babies';
import { useOurPlan } from '../api/get-our-plan';
import { BabyPicker } from './baby-picker';
import { PlanCard } from './plan-card';

/** The family's baby (chosen in the address bar when there are several) and that baby's approved plan. */
export function OurPlan() {
  const [params] = useSearchParams();
  const babies = useOurBabies();
  const list = babies.data ?? [];
  const chosen = list.find((baby) => baby.id === params.get('baby')) ?? list[0];
  const plan = useOurPlan(chosen?.id ?? '');

  if (babies.isPending) return <Spinner label="Loading your plan" />;
  if (babies.isError) return <Alert>{errorMessage(babies.error)}</Alert>;
  return (
    <div className="flex flex-col gap-4">
      {list.length > 1 && chosen && <BabyPicker babies={list} chosenId={chosen.id} />}
      {chosen && list.length === 1 && <p className="text-xl text-ink-700">For {chosen.name}</p>}
      {plan.isError ? (
        <Alert>{errorMessage(plan.error)}</Alert>
      ) : chosen && plan.isPending ? (
        <Spinner label="Loading your plan" />
      ) : (
        <PlanCard plan={plan.data ?? null} />
      )}
    </div>
  );
}
