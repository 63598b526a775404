import { subject } from '@casl/ability';
import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useParams } from 'react-router-dom';
import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { useInfant } from '../../features/infants/api/get-infant';
import { monitoringKeys } from '../../features/monitoring/api/monitoring-keys';
import { RecordingUpload } from '../../features/recordings/components/recording-upload';
import { useAppAbility } from '../../lib/ability';
import { infantLoadFallback } from '../../features/infants/components/infant-load-state';
import { useSignedInUser } from '../../lib/signed-in-user';
import { BackToRecordLink } from '../../features/infants/components/back-to-record-link';
import { usePageTitle } from '../../lib/page-title';


/** Upload one night's oximetry for a baby; on success the recording page follows the analysis. */
export function Component() {
  const { id = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const user = useSignedInUser();
  const ability = useAppAbility();
  const infant = useInfant(id);
  usePageTitle('Upload an overnight recording', infant.data?.name);

  const fallback = infantLoadFallback(infant, 'Loading the baby');
  if (fallback || !infant.data) return fallback;
  const baby = infant.data;
  // The same rule as the API: the coordinator, or the nurse whose caseload the baby is on.
  if (!ability.can('create', subject('Recording', { programmeId: user.programmeId, nurseId: baby.nurse?.id ?? null } as Record<string, unknown>))) {
    return (
      <>
        <PageHeader title="Upload an overnight recording" />
        <EmptyState message="Recordings are uploaded by the coordinator or the baby’s nurse."><BackToRecordLink infantId={baby.id} /></EmptyState>
      </>
    );
  }

  const onUploaded = (recordingId: string) => {
    // An overnight study check may be done by this upload.
    void queryClient.invalidateQueries({ queryKey: monitoringKeys.infant(baby.id) });
    navigate(`/recordings/${recordingId}`);
  };
  return (
    <>
      <PageHeader title={`Upload an overnight recording: ${baby.name}`} intro={`Corrected age ${baby.correctedAge}`} actions={<BackToRecordLink infantId={baby.id} />} />
      <div className="max-w-2xl">
        <Card>
          <RecordingUpload infantId={baby.id} familyTimeZone={baby.contacts[0]?.timeZone ?? user.programmeTimeZone} onUploaded={onUploaded} />
        </Card>
      </div>
    </>
  );
}
