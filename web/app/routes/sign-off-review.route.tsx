import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { PageHeader } from '../../components/ui/page-header';
import { Spinner } from '../../components/ui/spinner';
import { infantKeys } from '../../features/infants/api/infant-keys';
import { infantQueryOptions } from '../../features/infants/api/get-infant';
import { policyQueryOptions } from '../../features/infants/api/get-programme-data';
import { useDecidePrescription } from '../../features/prescriptions/api/decide-prescription';
import { usePrescription } from '../../features/prescriptions/api/get-prescription';
import { ProposalReview } from '../../features/prescriptions/components/proposal-review';
import { errorMessage } from '../../lib/api-error';
import { usePageTitle } from '../../lib/page-title';

function BackLink() {
  return (
    <Link to="/sign-off" className="font-semibold text-brand-700 underline">
      ← Sign-off queue
    </Link>
  );
}

export function Component() {
  const { prescriptionId = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const rx = usePrescription(prescriptionId);
  const infantId = rx.data?.infantId ?? '';
  const infant = useQuery({ ...infantQueryOptions(infantId), enabled: infantId !== '' });
  const policy = useQuery(policyQueryOptions());
  const decide = useDecidePrescription(prescriptionId, infant.data?.name);
  usePageTitle('Sign off', infant.data?.name);

  const onDecided = () => {
    // The decision changes the baby's status, current plan and history as well as the queue.
    void queryClient.invalidateQueries({ queryKey: infantKeys.detail(infantId) });
    void queryClient.invalidateQueries({ queryKey: infantKeys.lists() });
    navigate('/sign-off');
  };

  const failed = rx.error ?? infant.error;
  return (
    <>
      <PageHeader title="Review a proposal" actions={<BackLink />} />
      {failed ? (
        <Alert>{errorMessage(failed)}</Alert>
      ) : rx.data && infant.data ? (
        <ProposalReview
          rx={rx.data}
          infant={infant.data}
          steps={policy.data?.settings.flowmeterStepsLpm ?? null}
          stepsProblem={policy.isError ? errorMessage(policy.error) : undefined}
          mutation={decide}
          onDecided={onDecided}
        />
      ) : (
        <Spinner label="Loading the proposal" />
      )}
    </>
  );
}
