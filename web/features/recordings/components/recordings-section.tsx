import { Link, useSearchParams } from 'react-router-dom';
import type { PolicySettings } from '@shared/schemas/policy';
import type { Recording } from '@shared/schemas/recordings';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { useInfantRecordings } from '../api/get-infant-recordings';
import { overnightVerdict } from './overnight-verdict';
import { hoursMinutes, shareText, spo2Text } from './recording-format';
import { RecordingStatusBadge } from './recording-status';
import { VerdictLine } from './verdict-line';

const PAGE_SIZE = 5;
const PAGE_PARAM = 'recordingsPage';

interface RecordingsSectionProps {
  infantId: string;
  canUpload: boolean;
  settings: PolicySettings | undefined;
  pulmonaryHypertension: boolean;
}

function RecordingItem({ recording, settings, pulmonaryHypertension }: { recording: Recording } & Omit<RecordingsSectionProps, 'infantId' | 'canUpload'>) {
  const s = recording.summary;
  return (
    <li className="flex flex-col gap-1.5 rounded-xl border border-surface-200 p-3">
      <div className="flex flex-wrap items-center gap-2">
        <Link to={`/recordings/${recording.id}`} className="font-bold text-brand-700 underline">
          {recording.startedAt ? `Night of ${formatDateTime(recording.startedAt)}` : `Uploaded ${formatDateTime(recording.uploadedAt)}`}
        </Link>
        <RecordingStatusBadge status={recording.status} />
      </div>
      {s && (
        <p className="text-sm tabular-nums text-ink-900">
          Valid {hoursMinutes(s.validMinutes)} h · mean {spo2Text(s.meanSpo2)} · below 90 %: {shareText(s.pctBelow90)} · lowest {spo2Text(s.minSpo2)}
        </p>
      )}
      {s && settings && <div><VerdictLine compact verdict={overnightVerdict(s, settings, pulmonaryHypertension)} /></div>}
      {recording.status === 'failed' && recording.failureReason && <p className="text-sm text-danger-800">{recording.failureReason}</p>}
    </li>
  );
}

/** The baby's overnight recordings, newest first; the page number lives in the URL so a reload keeps it. */
export function RecordingsSection({ infantId, canUpload, settings, pulmonaryHypertension }: RecordingsSectionProps) {
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Number(params.get(PAGE_PARAM)) || 1);
  const list = useInfantRecordings(infantId, page, PAGE_SIZE);
  const pages = Math.max(1, Math.ceil((list.data?.total ?? 0) / PAGE_SIZE));
  const goTo = (next: number) =>
    setParams((current) => {
      const updated = new URLSearchParams(current);
      if (next === 1) updated.delete(PAGE_PARAM);
      else updated.set(PAGE_PARAM, String(next));
      return updated;
    }, { preventScrollReset: true });

  const upload = canUpload ? (
    <Link to={`/infants/${infantId}/recordings/new`} className={buttonClasses('secondary', 'sm')}>Upload a recording</Link>
  ) : undefined;
  return (
    <Card title="Overnight recordings" actions={upload}>
      {list.isPending && <Spinner label="Loading recordings" />}
      {list.isError && <Alert>{list.error.message}</Alert>}
      {list.data && list.data.total === 0 && <EmptyState message="No overnight recordings yet." />}
      {list.data && list.data.items.length > 0 && (
        <div className="flex flex-col gap-3">
          <ul className="flex flex-col gap-2">
            {list.data.items.map((recording) => (
              <RecordingItem key={recording.id} recording={recording} settings={settings} pulmonaryHypertension={pulmonaryHypertension} />
            ))}
          </ul>
          {pages > 1 && (
            <nav aria-label="Recording pages" className="flex flex-wrap items-center justify-between gap-2 text-sm text-ink-700">
              <span>Page {page} of {pages} · {list.data.total} recordings</span>
              <span className="flex gap-2">
                <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => goTo(page - 1)}>Newer</Button>
                <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => goTo(page + 1)}>Older</Button>
              </span>
            </nav>
          )}
        </div>
      )}
    </Card>
  );
}
