import { PageHeader } from '../../components/ui/page-header';
import { SignOffQueue } from '../../features/prescriptions/components/sign-off-queue';

export function Component() {
  return (
    <>
      <PageHeader title="Sign-off queue" intro="Proposed home settings waiting for your decision, longest wait first." />
      <SignOffQueue />
    </>
  );
}
