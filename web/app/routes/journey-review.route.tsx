import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { Spinner } from '../../components/ui/spinner';
import { infantKeys } from '../../features/infants/api/infant-keys';
import { useDecideJourney } from '../../features/journeys/api/decide-journey';
import { useJourney } from '../../features/journeys/api/get-journey';
import { JourneyReview } from '../../features/journeys/components/journey-review';
import { useAppAbility } from '../../lib/ability';
import { errorMessage, isApiError } from '../../lib/api-error';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const { journeyId = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const ability = useAppAbility();
  const journey = useJourney(journeyId);
  const decide = useDecideJourney(journeyId);
  const canDecide = ability.can('approve', 'Journey');
  const title = canDecide && journey.data?.status === 'waiting' ? 'Review a journey check' : 'Journey check';
  usePageTitle(title, journey.data?.infantName);

  const onDecided = () => {
    // The decision is written to the baby's audit trail, which hangs under the baby's detail key.
    if (journey.data) void queryClient.invalidateQueries({ queryKey: infantKeys.detail(journey.data.infantId) });
    if (canDecide) navigate('/sign-off');
  };

  const back = canDecide ? (
    <Link to="/sign-off" className="font-semibold text-brand-700 underline">← Sign-off queue</Link>
  ) : undefined;
  let body;
  if (journey.isPending) body = <Spinner label="Loading the journey check" />;
  else if (journey.isError) {
    body = isApiError(journey.error) && [400, 404].includes(journey.error.status)
      ? <EmptyState message="This journey check is not in your records. The link may be wrong." />
      : <Alert>{errorMessage(journey.error)}</Alert>;
  } else body = <JourneyReview journey={journey.data} canDecide={canDecide} mutation={decide} onDecided={onDecided} />;
  return (
    <>
      <PageHeader title={title} actions={back} />
      {body}
    </>
  );
}
