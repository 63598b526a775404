import { PageHeader } from '../../components/ui/page-header';
import { SignOffQueue } from '../../features/prescriptions/components/sign-off-queue';
import { WaitingJourneys } from '../../features/journeys/components/waiting-journeys';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Sign-off queue');
  return (
    <>
      <PageHeader title="Sign-off queue" intro="Proposed home settings waiting for your decision, longest wait first." />
      <SignOffQueue />
      <section aria-labelledby="journeys-waiting" className="mt-8 flex flex-col gap-3">
        <h2 id="journeys-waiting" className="text-xl font-bold text-ink-900">Journey checks waiting</h2>
        <WaitingJourneys />
      </section>
    </>
  );
}
