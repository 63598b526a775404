import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { OurPlan } from '../../features/family/components/our-plan';

/** Phone-first and large type: families read this at home, often one-handed, often tired. */
export function Component() {
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <div>
        <h1 className="text-3xl font-bold text-ink-900 sm:text-4xl">Our plan</h1>
        <p className="mt-2 text-xl leading-relaxed text-ink-700">Your baby's oxygen at home, and your next visits.</p>
      </div>
      <OurPlan />
      <Card title="Next visits">
        <EmptyState large message="Visits booked by your home-care team will show here." />
      </Card>
      <section className="rounded-2xl border-2 border-danger-600 bg-danger-50 p-5">
        <h2 className="text-2xl font-bold text-danger-800">In an emergency</h2>
        <p className="mt-2 text-xl leading-relaxed text-ink-900">
          If you are worried your baby is seriously unwell, call your local emergency number straight away, then
          tell your home-care team.
        </p>
      </section>
    </div>
  );
}
