import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { Card } from '../../components/ui/card';
import { DownloadLink } from '../../components/ui/download-link';
import { listInfantsQuerySchema } from '@shared/schemas/infants';
import { exportHref } from '../../lib/export-href';
import { PageHeader } from '../../components/ui/page-header';
import { CaseloadFilters } from '../../features/infants/components/caseload-filters';
import { CaseloadTable } from '../../features/infants/components/caseload-table';
import { offersMine, useCaseloadView } from '../../features/infants/hooks/use-caseload-view';
import { useAppAbility } from '../../lib/ability';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const user = useSignedInUser();
  const ability = useAppAbility();
  const offerMine = offersMine(user.role);
  const { query, update } = useCaseloadView(user.role);
  const nurse = user.role === 'nurse';
  usePageTitle(nurse ? 'My caseload' : 'Caseload');
  return (
    <>
      <PageHeader
        title={nurse ? 'My caseload' : 'Caseload'}
        intro={nurse ? 'The babies you visit, with their current plan.' : 'Babies in the programme, with their current plan.'}
        actions={
          <div className="flex flex-wrap gap-2">
            <DownloadLink href={exportHref('/api/infants.csv', listInfantsQuerySchema, query)} size="md" />
            {ability.can('create', 'Infant') && (
              <Link to="/enrol" className={buttonClasses()}>
                Enrol a baby
              </Link>
            )}
          </div>
        }
      />
      <Card>
        <div className="flex flex-col gap-4">
          <CaseloadFilters query={query} update={update} offerMine={offerMine} />
          <CaseloadTable
            query={query}
            update={update}
            emptyMessage={nurse ? 'No babies are assigned to you yet.' : 'No babies enrolled yet.'}
          />
        </div>
      </Card>
    </>
  );
}
