import type { ReactNode } from 'react';
import type { Recording } from '@shared/schemas/recordings';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { showToast } from '../../../components/ui/toast-store';
import { formatDateTime } from '../../../lib/format';
import { fileSizeText } from './upload-messages';
import { hoursMinutes, shortHash } from './recording-format';
import { numberInWords } from '@shared/format/number-words';

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-500">{label}</dt>
      <dd className="min-w-0 break-words text-ink-900">{children}</dd>
    </>
  );
}

function copyHash(sha256: string) {
  navigator.clipboard
    .writeText(sha256)
    .then(() => showToast('ok', 'SHA-256 copied.'))
    .catch(() => showToast('danger', 'Could not copy. Select the fingerprint in the file details instead.'));
}

/** Where the figures came from: the exact file (by its SHA-256), who brought it in, and which analysis read it. */
export function RecordingFacts({ recording }: { recording: Recording }) {
  return (
    <Card title="File and analysis">
      <dl className="grid gap-x-4 gap-y-1.5 text-sm sm:grid-cols-[10rem_1fr]">
        <Row label="File">{recording.fileName} ({fileSizeText(recording.byteSize)})</Row>
        <Row label="SHA-256">
          <span className="flex flex-wrap items-center gap-2">
            <code title={recording.sha256} className="font-mono">{shortHash(recording.sha256)}</code>
            <Button variant="quiet" size="sm" onClick={() => copyHash(recording.sha256)} aria-label="Copy the full SHA-256">
              Copy
            </Button>
          </span>
        </Row>
        <Row label="Uploaded">
          {formatDateTime(recording.uploadedAt)}
          {recording.uploadedBy && ` by ${recording.uploadedBy.name}`}
        </Row>
        <Row label="Started">{recording.startedAt ? formatDateTime(recording.startedAt) : 'Not in the file (times counted from the start)'}</Row>
        <Row label="Length (h:mm)">{hoursMinutes(recording.durationMinutes)}</Row>
        <Row label="Samples">
          {numberInWords(recording.sampleCount)} every {recording.samplePeriodSec} s
          {recording.skippedRows > 0 && `, ${recording.skippedRows} unreadable ${recording.skippedRows === 1 ? 'row' : 'rows'} skipped`}
        </Row>
        <Row label="Analysis">
          {recording.analysisVersion ?? 'Not yet'}
          {recording.analysedAt && `, ${formatDateTime(recording.analysedAt)}`}
        </Row>
      </dl>
    </Card>
  );
}
