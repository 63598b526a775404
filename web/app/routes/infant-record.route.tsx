import { useMemo } from 'react';
import { subject } from '@casl/ability';
import { useQueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import type { InfantDetail } from '@shared/schemas/infants';
import { dischargeClosed } from '@shared/discharge/readiness';
import type { Prescription } from '@shared/schemas/prescriptions';
import { ReadingsChart } from '../../features/charts/components/readings-chart';
import { useInfant } from '../../features/infants/api/get-infant';
import { useInfantPrescriptions } from '../../features/infants/api/get-infant-prescriptions';
import { infantKeys } from '../../features/infants/api/infant-keys';
import { AuditSection } from '../../features/infants/components/audit-section';
import { ReadsSection } from '../../features/audit/components/reads-section';
import { ContactsSection } from '../../features/infants/components/contacts-section';
import { DetailsSection } from '../../features/infants/components/details-section';
import { FhirDownloadLink } from '../../features/infants/components/fhir-download-link';
import { InfantHeader } from '../../features/infants/components/infant-header';
import { PlanSection } from '../../features/infants/components/plan-section';
import { VersionsSection } from '../../features/infants/components/versions-section';
import { JourneysSection } from '../../features/journeys/components/journeys-section';
import { useOvernightTargets } from '../../features/monitoring/api/get-overnight-targets';
import { ReadingsSection } from '../../features/monitoring/components/readings-section';
import { ScheduleSection } from '../../features/monitoring/components/schedule-section';
import { StepDownAction } from '../../features/monitoring/components/step-down-action';
import { StepEvidenceSection } from '../../features/monitoring/components/step-evidence-section';
import { readingsDescription, targetBand } from '../../features/monitoring/components/target-band';
import { RecordingsSection } from '../../features/recordings/components/recordings-section';
import { VisitsSection } from '../../features/visits/components/visits-section';
import { DischargeSection } from '../../features/discharge/components/discharge-section';
import { EquipmentSection } from '../../features/equipment-orders/components/equipment-section';
import { useAppAbility } from '../../lib/ability';
import { infantLoadFallback } from '../../features/infants/components/infant-load-state';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';


/** Readings, recordings, checks and the step-down request: the monitoring half of the record. */
function useMonitoring(infant: InfantDetail, versions: Prescription[]) {
  const user = useSignedInUser();
  const ability = useAppAbility();
  const queryClient = useQueryClient();
  const targets = useOvernightTargets();
  // The same rules as the API: the coordinator, or the nurse whose caseload the baby is on.
  // A fresh object per check: CASL stamps the subject type on the object it is given.
  const own = (): Record<string, unknown> => ({ programmeId: user.programmeId, nurseId: infant.nurse?.id ?? null });
  const ph = infant.diagnoses.includes('pulmonary_hypertension');
  const setting = infant.activeSetting;
  const onOxygen = !!setting && (setting.flowLpm > 0 || Object.values(setting.periods ?? {}).some((flow) => flow > 0));
  return {
    ph,
    settings: targets.data?.settings,
    band: targets.data ? targetBand(targets.data.settings, ph) : undefined,
    canLog: ability.can('create', subject('Reading', own())),
    canUpload: ability.can('create', subject('Recording', own())),
    canManageVisits: ability.can('create', subject('Visit', own())),
    canStepDown: onOxygen && ability.can('create', subject('StepDown', own())),
    waiting: versions.some((rx) => rx.status === 'preparing' || rx.status === 'proposed'),
    // The new proposal changes the versions, the status and the trail, which all hang under the baby's detail key.
    onStepDownRequested: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: infantKeys.detail(infant.id) }),
        queryClient.invalidateQueries({ queryKey: infantKeys.lists() }),
      ]),
  };
}

function Monitoring({ infant, versions }: { infant: InfantDetail; versions: Prescription[] }) {
  const m = useMonitoring(infant, versions);
  return (
    <>
      {m.canStepDown && <StepDownAction infantId={infant.id} waiting={m.waiting} onRequested={() => void m.onStepDownRequested()} />}
      <ScheduleSection infantId={infant.id} />
      <VisitsSection infantId={infant.id} canManage={m.canManageVisits} />
      <ReadingsSection
        infantId={infant.id}
        canLog={m.canLog}
        bandMin={m.band?.min}
        chart={(readings) =>
          m.band && <ReadingsChart readings={readings} band={m.band} description={readingsDescription(readings, m.band)} />
        }
      />
      <RecordingsSection infantId={infant.id} canUpload={m.canUpload} settings={m.settings} pulmonaryHypertension={m.ph} />
    </>
  );
}

export function Component() {
  const { id = '' } = useParams();
  const ability = useAppAbility();
  const user = useSignedInUser();
  const infant = useInfant(id);
  usePageTitle('Record', infant.data?.name);
  const prescriptions = useInfantPrescriptions(id);
  const versions = useMemo(
    () => [...(prescriptions.data?.items ?? [])].sort((a, b) => b.version - a.version),
    [prescriptions.data],
  );

  const fallback = infantLoadFallback(infant, 'Loading the record', true);
  if (fallback || !infant.data) return fallback;

  const canEdit = ability.can('update', 'Infant');
  // The same rules as the API: a fresh object per check (CASL stamps the subject type on it).
  const own = (): Record<string, unknown> => ({ programmeId: user.programmeId, infantId: infant.data!.id, nurseId: infant.data!.nurse?.id ?? null });
  const dischargeRights = {
    canChange: ability.can('update', subject('Discharge', own())),
    canOverride: ability.can('approve', subject('Discharge', own())),
    canBookVisit: ability.can('create', subject('Visit', own())),
  };
  return (
    <>
      <InfantHeader infant={infant.data} />
      {/* Staff only, as the API: reading the overnight recordings is the staff right the export checks. */}
      {ability.can('read', 'Recording') && (
        <div className="-mt-3 mb-6 flex flex-wrap gap-2">
          <FhirDownloadLink infantId={infant.data.id} />
        </div>
      )}
      {/* The day-to-day monitoring sits in the first column, so on a phone it comes straight after the plan. */}
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <div className="flex min-w-0 flex-col gap-6">
          <PlanSection
            infant={infant.data}
            prescriptions={{ data: prescriptions.data ? versions : undefined, isPending: prescriptions.isPending, error: prescriptions.error }}
          />
          <Monitoring infant={infant.data} versions={versions} />
        </div>
        <div className="flex min-w-0 flex-col gap-6">
          <DischargeSection infantId={infant.data.id} rights={dischargeRights} closed={dischargeClosed(infant.data.status)} />
          <DetailsSection infant={infant.data} canEdit={canEdit} />
          <ContactsSection infant={infant.data} canEdit={canEdit} />
          <JourneysSection infantId={infant.data.id} canRequest={ability.can('create', 'Journey')} />
          {ability.can('read', 'EquipmentOrder') && (
            <EquipmentSection infantId={infant.data.id} familyAddress={infant.data.home.address} canManage={ability.can('create', 'EquipmentOrder')} />
          )}
          <StepEvidenceSection versions={versions} />
          <VersionsSection versions={versions} />
          {ability.can('read', 'AuditEvent') && prescriptions.data && (
            <AuditSection infantId={infant.data.id} versionsState={versions.map((rx) => `${rx.version}-${rx.status}`).join(',')} />
          )}
          {ability.can('read', 'AccessLog') && <ReadsSection infantId={infant.data.id} />}
        </div>
      </div>
    </>
  );
}
