import { PageHeader } from '../../components/ui/page-header';
import { EnrolForm } from '../../features/infants/components/enrol-form';

export function Component() {
  return (
    <>
      <PageHeader title="Enrol a baby" intro="The baby, the hospital setting, the home and the people to keep informed." />
      <EnrolForm />
    </>
  );
}
