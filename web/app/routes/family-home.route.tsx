import { Card } from '../../components/ui/card';
import { useSearchParams } from 'react-router-dom';
import { OurPlan } from '../../features/family/components/our-plan';
import { useOurBabies } from '../../features/family/api/get-our-babies';
import { ReadingForm } from '../../features/readings/components/reading-form';
import { NextVisits } from '../../features/visits/components/next-visits';
import { showToast } from '../../components/ui/toast-store';
import { CylinderLinkCard } from '../../features/family/components/cylinder-link-card';
import { EmergencySection } from '../../features/family/components/emergency-section';
import { OxygenSafety } from '../../features/family/components/oxygen-safety';
import { WhoToCall } from '../../features/family/components/who-to-call';
import { CurrentTrips, PlanningATrip } from '../../features/journeys/components/family-trips';
import { todayIn } from '../../features/journeys/components/journey-words';
import { useSignedInUser } from '../../lib/signed-in-user';

/** Phone-first and large type: families read this at home, often one-handed, often tired. */
export function Component() {
  const [params] = useSearchParams();
  const babies = useOurBabies().data ?? [];
  const baby = babies.find((b) => b.id === params.get('baby')) ?? babies[0];
  const today = todayIn(useSignedInUser().programmeTimeZone);
  const withBaby = (path: string) => (baby ? `${path}?baby=${baby.id}` : path);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <div>
        <h1 className="text-3xl font-bold text-ink-900 sm:text-4xl">Our plan</h1>
        <p className="mt-2 text-xl leading-relaxed text-ink-700">Your baby's oxygen at home, and your next visits.</p>
      </div>
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
          <ReadingForm infantId={baby.id} forFamily onSaved={() => showToast('ok', 'Thank you: the team can see your reading.')} />
        </Card>
      )}
    </div>
  );
}
