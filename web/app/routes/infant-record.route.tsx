import { useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { Spinner } from '../../components/ui/spinner';
import { useInfant } from '../../features/infants/api/get-infant';
import { useInfantPrescriptions } from '../../features/infants/api/get-infant-prescriptions';
import { AuditSection } from '../../features/infants/components/audit-section';
import { ContactsSection } from '../../features/infants/components/contacts-section';
import { DetailsSection } from '../../features/infants/components/details-section';
import { InfantHeader } from '../../features/infants/components/infant-header';
import { PlanSection } from '../../features/infants/components/plan-section';
import { VersionsSection } from '../../features/infants/components/versions-section';
import { useAppAbility } from '../../lib/ability';
import { isApiError } from '../../lib/api-error';

function NoSuchBaby() {
  return (
    <>
      <PageHeader title="No such baby in your records" />
      <EmptyState message="This baby is not in your records. The link may be wrong, or the baby may be looked after by another team.">
        <Link to="/caseload" className="font-semibold text-brand-700 underline">
          Go to the caseload
        </Link>
      </EmptyState>
    </>
  );
}

export function Component() {
  const { id = '' } = useParams();
  const ability = useAppAbility();
  const infant = useInfant(id);
  const prescriptions = useInfantPrescriptions(id);
  const versions = useMemo(
    () => [...(prescriptions.data?.items ?? [])].sort((a, b) => b.version - a.version),
    [prescriptions.data],
  );

  if (infant.isPending) return <Spinner label="Loading the record" />;
  if (infant.isError) {
    // 400 (not an id) and 404 (unknown, or another programme's) read the same to the person.
    if (isApiError(infant.error) && [400, 404].includes(infant.error.status)) return <NoSuchBaby />;
    return <Alert>{infant.error.message}</Alert>;
  }

  const canEdit = ability.can('update', 'Infant');
  return (
    <>
      <InfantHeader infant={infant.data} />
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <div className="flex min-w-0 flex-col gap-6">
          <PlanSection
            infant={infant.data}
            prescriptions={{ data: prescriptions.data ? versions : undefined, isPending: prescriptions.isPending, error: prescriptions.error }}
          />
          <DetailsSection infant={infant.data} canEdit={canEdit} />
          <ContactsSection infant={infant.data} canEdit={canEdit} />
        </div>
        <div className="flex min-w-0 flex-col gap-6">
          <VersionsSection versions={versions} />
          {ability.can('read', 'AuditEvent') && prescriptions.data && (
            <AuditSection infantId={infant.data.id} versionsState={versions.map((rx) => `${rx.version}-${rx.status}`).join(',')} />
          )}
        </div>
      </div>
    </>
  );
}
