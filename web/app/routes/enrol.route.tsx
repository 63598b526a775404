import { PageHeader } from '../../components/ui/page-header';
import { EnrolForm } from '../../features/infants/components/enrol-form';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Enrol a baby');
  return (
    <>
      <PageHeader title="Enrol a baby" intro="The baby, the hospital setting, the home and the people to keep informed." />
      <EnrolForm />
    </>
  );
}
