import { RECORDING_STATUS_LABELS, type Recording } from '@shared/schemas/recordings';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Spinner } from '../../../components/ui/spinner';

type Tone = Parameters<typeof Badge>[0]['tone'];
const TONES: Record<Recording['status'], Tone> = { queued: 'muted', analysing: 'brand', done: 'ok', failed: 'danger' };

export function RecordingStatusBadge({ status }: { status: Recording['status'] }) {
  return <Badge tone={TONES[status]}>{RECORDING_STATUS_LABELS[status]}</Badge>;
}

/** While the worker has the file, and when it gave up: said in words, with the reason. */
export function RecordingProgress({ recording }: { recording: Recording }) {
  if (recording.status === 'failed') {
    return (
      <Alert>
        This recording could not be analysed{recording.failureReason ? `: ${recording.failureReason}` : '.'}
        <span className="mt-1 block text-sm font-normal">The file is kept. Check the export and upload it again if needed.</span>
      </Alert>
    );
  }
  if (recording.status === 'done') return null;
  return (
    <div className="flex flex-col gap-1 rounded-xl border border-surface-200 bg-surface-0 p-4">
      <Spinner label={RECORDING_STATUS_LABELS[recording.status]} />
      <p className="text-sm text-ink-700">The figures appear here by themselves when the analysis is done, usually within a minute.</p>
    </div>
  );
}
