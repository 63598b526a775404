import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { Journey } from '@shared/schemas/journeys';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { useInfant } from '../../features/infants/api/get-infant';
import { infantLoadFallback } from '../../features/infants/components/infant-load-state';
import { JourneyForm } from '../../features/journeys/components/journey-form';
import { JourneySent } from '../../features/journeys/components/journey-sent';
import { todayIn } from '../../features/journeys/components/journey-words';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

/** The coordinator arranges a trip check for a baby on the family's behalf. */
export function Component() {
  const { id = '' } = useParams();
  const { programmeTimeZone } = useSignedInUser();
  const infant = useInfant(id);
  usePageTitle('New journey check', infant.data?.name);
  const [sent, setSent] = useState<Journey | null>(null);
  const fallback = infantLoadFallback(infant, 'Loading the record', true);
  if (fallback || !infant.data) return fallback;
  const record = `/infants/${infant.data.id}`;
  return (
    <>
      <PageHeader
        title={`New journey check · ${infant.data.name}`}
        intro="The flow needed at the destination or in an aircraft cabin, and the cylinders for the time away. The consultant signs it off."
        actions={<Link to={record} className="font-semibold text-brand-700 underline">← Back to the record</Link>}
      />
      <div className="max-w-2xl">
        {sent ? (
          <JourneySent journey={sent}>
            <Link to={`/journeys/${sent.id}`} className="self-start font-semibold text-brand-700 underline">
              Open the journey check
            </Link>
          </JourneySent>
        ) : (
          <Card>
            <JourneyForm infantId={infant.data.id} today={todayIn(programmeTimeZone)} onSent={setSent} />
          </Card>
        )}
      </div>
    </>
  );
}
