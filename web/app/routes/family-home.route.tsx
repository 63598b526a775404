import { Card } from '../../components/ui/card';
import { useSearchParams } from 'react-router-dom';
import { OurPlan } from '../../features/family/components/our-plan';
import { useOurBabies } from '../../features/family/api/get-our-babies';
import { ReadingForm } from '../../features/readings/components/reading-form';
import { NextVisits } from '../../features/visits/components/next-visits';
import { showToast } from '../../components/ui/toast-store';

/** Phone-first and large type: families read this at home, often one-handed, often tired. */
export function Component() {
  const [params] = useSearchParams();
  const babies = useOurBabies().data ?? [];
  const baby = babies.find((b) => b.id === params.get('baby')) ?? babies[0];
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <div>
        <h1 className="text-3xl font-bold text-ink-900 sm:text-4xl">Our plan</h1>
        <p className="mt-2 text-xl leading-relaxed text-ink-700">Your baby's oxygen at home, and your next visits.</p>
      </div>
      <OurPlan />
      <NextVisits infantId={baby?.id} />
      <section className="rounded-2xl border-2 border-danger-600 bg-danger-50 p-5">
        <h2 className="text-2xl font-bold text-danger-800">In an emergency</h2>
        <p className="mt-2 text-xl leading-relaxed text-ink-900">
          If you are worried your baby is seriously unwell, call your local emergency number straight away, then
          tell your home-care team.
        </p>
      </section>
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
