import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { FamilyPageHeader } from '../../components/ui/page-header';
import { FoldedSection } from '../../components/ui/folded-section';
import { OurPlan } from '../../features/family/components/our-plan';
import { useOurBabies } from '../../features/family/api/get-our-babies';
import { ReadingForm } from '../../features/readings/components/reading-form';
import { NextVisits } from '../../features/visits/components/next-visits';
import { FamilyDischarge } from '../../features/discharge/components/family-discharge';
import { SavedNote } from '../../components/ui/saved-note';
import { CylinderLinkCard } from '../../features/family/components/cylinder-link-card';
import { useOurPlan } from '../../features/family/api/get-our-plan';
import { asksForNoOxygen } from '@shared/equipment/concentrator-fit';
import { EmergencySection } from '../../features/family/components/emergency-section';
import { OxygenSafety } from '../../features/family/components/oxygen-safety';
import { WhoToCall } from '../../features/family/components/who-to-call';
import { CurrentTrips, PlanningATrip } from '../../features/journeys/components/family-trips';
import { todayIn, tripIsCurrent } from '../../features/journeys/components/journey-words';
import { formatDate } from '../../lib/format';
import { useInfantJourneys } from '../../features/journeys/api/get-journeys';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

/**
 * A trip under way is today's setting, shown in full; one still days ahead folds under its dates, so the week
 * before a trip does not push everything else down.
 */
function TripSoon({ infantId, today }: { infantId: string; today: string }) {
  const soon = (useInfantJourneys(infantId).data ?? []).filter((j) => tripIsCurrent(j, today));
  if (soon.length === 0) return null;
  if (soon.some((j) => j.request.departOn <= today)) return <CurrentTrips infantId={infantId} today={today} />;
  const first = [...soon].sort((a, b) => a.request.departOn.localeCompare(b.request.departOn))[0];
  return (
    <FoldedSection title={`Your trip to ${first.request.destinationName}`} large summary={`Approved, ${formatDate(first.request.departOn)} to ${formatDate(first.request.returnOn)}: the setting there and what to take.`}>
      <CurrentTrips infantId={infantId} today={today} />
    </FoldedSection>
  );
}

/**
 * Phone-first and large type: families read this at home, often one-handed, often tired. Ordered by urgency: what
 * to do in an emergency, today's setting with its cautions, the next visits and a trip about to start; the rest is
 * folded under its heading.
 */
export function Component() {
  const [params] = useSearchParams();
  const babies = useOurBabies().data ?? [];
  const baby = babies.find((b) => b.id === params.get('baby')) ?? babies[0];
  const today = todayIn(useSignedInUser().programmeTimeZone);
  const [sent, setSent] = useState(0);
  const withBaby = (path: string) => (baby ? `${path}?baby=${baby.id}` : path);
  // The same query as the plan card's; off oxygen there is no cylinder time to work out and no cannula to check.
  const plan = useOurPlan(baby?.id ?? '').data;
  const offOxygen = !!plan && asksForNoOxygen(plan.approvedFlowLpm, plan.periods);
  usePageTitle('Our plan', baby?.name);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <FamilyPageHeader title="Our plan" intro="What to do in an emergency, your baby's oxygen today, and your next visits." />
      <EmergencySection onOxygen={!offOxygen} />
      <OurPlan />
      <NextVisits infantId={baby?.id} />
      {baby && <TripSoon infantId={baby.id} today={today} />}
      {baby && <FamilyDischarge infantId={baby.id} today={today} />}
      <div className="flex flex-col gap-3">
        <WhoToCall />
        {baby && !offOxygen && <CylinderLinkCard href={withBaby('/family/cylinder')} />}
        {baby && (
          <FoldedSection title="Trips" large summary="Trips ahead, and asking for a trip check.">
            <PlanningATrip infantId={baby.id} today={today} newTripHref={withBaby('/family/journey')} />
          </FoldedSection>
        )}
        <OxygenSafety />
        {baby && (
          <FoldedSection title="Tell the team a reading" large summary="Send an oxygen level you checked at home.">
            <p className="mb-3 text-lg text-ink-700">
              If you check your baby's oxygen level at home, you can send it here. It is marked as taken by the family.
              It does not replace calling the team if you are worried.
            </p>
            <div className="flex flex-col gap-4">
              {sent > 0 && <SavedNote key={sent} large>Thank you: the team can see your reading.</SavedNote>}
              <ReadingForm infantId={baby.id} forFamily onSaved={() => setSent((n) => n + 1)} />
            </div>
          </FoldedSection>
        )}
      </div>
      <Link to="/family/preferences" className="inline-flex min-h-13 items-center self-start rounded-xl border-2 border-brand-600 bg-surface-0 px-5 text-xl font-semibold text-brand-800">
        Contact details and reminders
      </Link>
    </div>
  );
}
