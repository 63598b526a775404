import { useState } from 'react';
import { Card } from '../../components/ui/card';
import { FamilyPageHeader } from '../../components/ui/page-header';
import { useSearchParams } from 'react-router-dom';
import { OurPlan } from '../../features/family/components/our-plan';
import { useOurBabies } from '../../features/family/api/get-our-babies';
import { ReadingForm } from '../../features/readings/components/reading-form';
import { NextVisits } from '../../features/visits/components/next-visits';
import { SavedNote } from '../../components/ui/saved-note';
import { CylinderLinkCard } from '../../features/family/components/cylinder-link-card';
import { EmergencySection } from '../../features/family/components/emergency-section';
import { OxygenSafety } from '../../features/family/components/oxygen-safety';
import { WhoToCall } from '../../features/family/components/who-to-call';
import { CurrentTrips, PlanningATrip } from '../../features/journeys/components/family-trips';
import { todayIn } from '../../features/journeys/components/journey-words';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

/** Phone-first and large type: families read this at home, often one-handed, often tired. */
export function Component() {
  const [params] = useSearchParams();
  const babies = useOurBabies().data ?? [];
  const baby = babies.find((b) => b.id === params.get('baby')) ?? babies[0];
  const today = todayIn(useSignedInUser().programmeTimeZone);
  const [sent, setSent] = useState(0);
  const withBaby = (path: string) => (baby ? `${path}?baby=${baby.id}` : path);
  usePageTitle('Our plan', baby?.name);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <FamilyPageHeader title="Our plan" intro="Your baby's oxygen at home, and your next visits." />
      <OurPlan />
      {baby && <CurrentTrips infantId={baby.id} today={today} />}
      <NextVisits infantId={baby?.id} />
      <EmergencySection />
      <WhoToCall />
      {baby && <CylinderLinkCard href={withBaby('/family/cylinder')} />}
      {baby && <PlanningATrip infantId={baby.id} today={today} newTripHref={withBaby('/family/journey')} />}
      <OxygenSafety />
      {baby && (
        <Card title="Tell the team a reading">
          <p className="mb-3 text-lg text-ink-700">
            If you check your baby's oxygen level at home, you can send it here. It is marked as taken by the family.
            It does not replace calling the team if you are worried.
          </p>
          <div className="flex flex-col gap-4">
            {sent > 0 && <SavedNote key={sent} large>Thank you: the team can see your reading.</SavedNote>}
            <ReadingForm infantId={baby.id} forFamily onSaved={() => setSent((n) => n + 1)} />
          </div>
        </Card>
      )}
    </div>
  );
}
