import { useEffect, useRef } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Recording } from '@shared/schemas/recordings';
import { Alert } from '../../components/ui/alert';
import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { Spinner } from '../../components/ui/spinner';
import { PulseTraceChart } from '../../features/charts/components/pulse-trace-chart';
import { Spo2TraceChart } from '../../features/charts/components/spo2-trace-chart';
import { infantQueryOptions } from '../../features/infants/api/get-infant';
import { infantKeys } from '../../features/infants/api/infant-keys';
import { useOvernightTargets } from '../../features/monitoring/api/get-overnight-targets';
import { monitoringKeys } from '../../features/monitoring/api/monitoring-keys';
import { isSettled, useRecording, useRecordingTrace } from '../../features/recordings/api/get-recording';
import { recordingKeys } from '../../features/recordings/api/recording-keys';
import { DesaturationTable } from '../../features/recordings/components/desaturation-table';
import { RecordingFacts } from '../../features/recordings/components/recording-facts';
import { RecordingProgress, RecordingStatusBadge } from '../../features/recordings/components/recording-status';
import { RecordingSummaryCard } from '../../features/recordings/components/recording-summary';
import { pulseDescription, traceDescription } from '../../features/recordings/components/trace-description';
import { useReplaceAnalysingToast } from '../../features/recordings/api/analysing-toast';
import { errorMessage, isApiError } from '../../lib/api-error';
import { formatDateTime } from '../../lib/format';
import { BackToRecordLink } from '../../features/infants/components/back-to-record-link';
import { usePageTitle } from '../../lib/page-title';

/** When the analysis settles, the baby's flags, checks and perhaps a new step proposal change with it. */
function useRefreshBabyWhenSettled(recording: Recording | undefined) {
  const queryClient = useQueryClient();
  const wasPending = useRef(false);
  const settled = recording ? isSettled(recording) : false;
  useEffect(() => {
    if (!recording) return;
    if (!settled) wasPending.current = true;
    else if (wasPending.current) {
      wasPending.current = false;
      void queryClient.invalidateQueries({ queryKey: infantKeys.detail(recording.infantId) });
      void queryClient.invalidateQueries({ queryKey: infantKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: recordingKeys.infantLists(recording.infantId) });
      void queryClient.invalidateQueries({ queryKey: monitoringKeys.infant(recording.infantId) });
    }
  }, [recording, settled, queryClient]);
}

function TraceCard({ recording }: { recording: Recording }) {
  const trace = useRecordingTrace(recording.id, recording.status === 'done');
  return (
    <Card title="SpO2 through the night">
      {trace.isPending && <Spinner label="Loading the trace" />}
      {trace.isError && <Alert>{trace.error.message}</Alert>}
      {trace.data && (
        <div className="flex flex-col gap-5">
          <Spo2TraceChart trace={trace.data} startedAt={recording.startedAt} description={traceDescription(recording, trace.data)} />
          <div className="flex flex-col gap-2">
            <h3 className="font-bold text-ink-900">Pulse through the night</h3>
            <PulseTraceChart trace={trace.data} startedAt={recording.startedAt} description={pulseDescription(recording, trace.data)} />
          </div>
          <div className="flex flex-col gap-2">
            <h3 className="font-bold text-ink-900">Desaturation events ({trace.data.events.length})</h3>
            <DesaturationTable events={trace.data.events} startedAt={recording.startedAt} />
          </div>
        </div>
      )}
    </Card>
  );
}

function DoneView({ recording, infant }: { recording: Recording; infant: InfantDetail }) {
  const targets = useOvernightTargets();
  return (
    <div className="flex flex-col gap-6">
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        {recording.summary && (
          <RecordingSummaryCard
            summary={recording.summary}
            targets={targets.data}
            targetsProblem={targets.isError ? errorMessage(targets.error) : undefined}
            pulmonaryHypertension={infant.diagnoses.includes('pulmonary_hypertension')}
          />
        )}
        <RecordingFacts recording={recording} />
      </div>
      <TraceCard recording={recording} />
    </div>
  );
}

export function Component() {
  const { id = '' } = useParams();
  const recording = useRecording(id);
  const infantId = recording.data?.infantId ?? '';
  const infant = useQuery({ ...infantQueryOptions(infantId), enabled: infantId !== '' });
  usePageTitle('Overnight recording', infant.data?.name);
  useRefreshBabyWhenSettled(recording.data);
  useReplaceAnalysingToast(recording.data);

  if (recording.isError) {
    if (isApiError(recording.error) && [400, 404].includes(recording.error.status)) {
      return (
        <>
          <PageHeader title="No such recording in your records" />
          <EmptyState message="This recording is not in your records. The link may be wrong, or the baby may be looked after by another team.">
            <Link to="/caseload" className="font-semibold text-brand-700 underline">Go to the caseload</Link>
          </EmptyState>
        </>
      );
    }
    return <Alert>{recording.error.message}</Alert>;
  }
  if (infant.isError) return <Alert>{errorMessage(infant.error)}</Alert>;
  if (!recording.data || !infant.data) return <Spinner label="Loading the recording" />;

  const r = recording.data;
  const baby = infant.data;
  const when = r.startedAt ? `Night of ${formatDateTime(r.startedAt)}` : `Uploaded ${formatDateTime(r.uploadedAt)}`;
  return (
    <>
      <PageHeader
        title={`Overnight recording: ${baby.name}`}
        intro={`${when} · corrected age ${baby.correctedAge}`}
        actions={<BackToRecordLink infantId={baby.id} />}
      />
      <div className="mb-4 flex items-center gap-2">
        <span className="text-ink-700">Status:</span>
        <RecordingStatusBadge status={r.status} />
      </div>
      {r.status === 'done' ? (
        <DoneView recording={r} infant={baby} />
      ) : (
        <div className="flex max-w-3xl flex-col gap-6">
          <RecordingProgress recording={r} />
          <RecordingFacts recording={r} />
        </div>
      )}
    </>
  );
}
