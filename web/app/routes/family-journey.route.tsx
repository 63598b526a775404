import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { Journey } from '@shared/schemas/journeys';
import { Alert } from '../../components/ui/alert';
import { Card } from '../../components/ui/card';
import { FamilyPageHeader } from '../../components/ui/page-header';
import { Spinner } from '../../components/ui/spinner';
import { useOurBabies } from '../../features/family/api/get-our-babies';
import { JourneyForm } from '../../features/journeys/components/journey-form';
import { JourneySent } from '../../features/journeys/components/journey-sent';
import { todayIn } from '../../features/journeys/components/journey-words';
import { errorMessage } from '../../lib/api-error';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

/** A family asks for a trip check for their own baby; the consultant answers on the family page. */
export function Component() {
  const [params] = useSearchParams();
  const { programmeTimeZone } = useSignedInUser();
  const babies = useOurBabies();
  const baby = babies.data?.find((b) => b.id === params.get('baby')) ?? babies.data?.[0];
  const [sent, setSent] = useState<Journey | null>(null);
  const back = baby ? `/family?baby=${baby.id}` : '/family';
  usePageTitle('Planning a trip', baby?.name);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <Link to={back} className="self-start text-lg font-semibold text-brand-700 underline">
        ← Back to our plan
      </Link>
      <FamilyPageHeader title="Planning a trip?"
        intro={`Higher places and aircraft cabins have thinner air, so your baby may need more oxygen there. Tell us about the trip and the consultant will check it${baby ? ` for ${baby.name}` : ''}.`} />
      {babies.isPending ? (
        <Spinner label="Loading" />
      ) : babies.isError ? (
        <Alert>{errorMessage(babies.error)}</Alert>
      ) : !baby ? (
        <Alert>No baby is linked to your account yet. Ask your home-care team.</Alert>
      ) : sent ? (
        <JourneySent journey={sent}>
          <Link to={back} className="self-start text-xl font-semibold text-brand-700 underline">
            Back to our plan
          </Link>
        </JourneySent>
      ) : (
        <Card>
          <JourneyForm infantId={baby.id} today={todayIn(programmeTimeZone)} onSent={setSent} />
        </Card>
      )}
    </div>
  );
}
