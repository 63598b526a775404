import { useId, useRef, useState, type ChangeEvent } from 'react';
import { RECORDING_LIMITS } from '@shared/recordings/limits';
import type { RecordingUploadFields } from '@shared/schemas/recordings';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { detailMessages, isApiError } from '../../../lib/api-error';
import { useSavedMapping } from '../api/get-saved-mapping';
import { useUploadRecording } from '../api/upload-recording';
import { ColumnMapping } from './column-mapping';
import { fileSizeText, MAX_FILE_MB, uploadProblem, type UploadProblem } from './upload-messages';

interface RecordingUploadProps {
  infantId: string;
  /** Local clock times in a device file are read in this zone unless another is chosen. */
  familyTimeZone: string;
  onUploaded: (recordingId: string) => void;
}

function OurFormat() {
  return (
    <p className="text-sm text-ink-700">
      Our format: a CSV file whose first row is <code className="rounded bg-surface-100 px-1">timestamp,spo2,pulse</code>{' '}
      (optionally <code className="rounded bg-surface-100 px-1">status</code>), times as a date-time with offset or seconds from
      the start. Oximeter exports work too (separate date and time columns, semicolons, decimal commas, text lines above
      the table): you match their columns after choosing the file.
    </p>
  );
}

function ProblemAlert({ problem }: { problem: UploadProblem }) {
  return (
    <Alert>
      {problem.title}
      {problem.detail && <span className="mt-1 block text-sm font-normal">{problem.detail}</span>}
    </Alert>
  );
}

/** Choose a night's CSV export and send it; a file with other column names gets a matching step, not a dead end. */
// Answers settled by choosing in the matching step: other column names, dates that read two ways, the clock's zone.
const OPENS_MAPPING = new Set(['wrong_columns', 'date_order_unclear', 'clock_change']);

export function RecordingUpload({ infantId, familyTimeZone, onUploaded }: RecordingUploadProps) {
  const inputId = useId();
  const upload = useUploadRecording(infantId);
  const [file, setFile] = useState<File | null>(null);
  const [found, setFound] = useState<string[] | null>(null);
  const saved = useSavedMapping(infantId, found);
  const [localProblem, setLocalProblem] = useState<UploadProblem | null>(null);
  // A second tap can land before the button re-renders as disabled; one file must be sent once.
  const sending = useRef(false);

  const choose = (event: ChangeEvent<HTMLInputElement>) => {
    setFile(event.target.files?.[0] ?? null);
    setFound(null);
    setLocalProblem(null);
    upload.reset();
  };

  const send = (fields?: RecordingUploadFields) => {
    if (!file) return setLocalProblem({ title: 'Choose a recording file first.' });
    // Checked here as well, so a phone does not send 20 MB only to be refused.
    if (file.size > RECORDING_LIMITS.maxFileBytes) {
      return setLocalProblem({ title: `This file is ${fileSizeText(file.size)}; the most one recording may be is ${MAX_FILE_MB} MB. Check that it is a single night’s export.` });
    }
    if (sending.current) return;
    sending.current = true;
    setLocalProblem(null);
    upload.mutate(
      { file, fields },
      {
        onSuccess: (result) => onUploaded(result.id),
        onError: (error) => {
          if (isApiError(error) && OPENS_MAPPING.has(error.code) && error.details?.found) {
            const headers = detailMessages(error.details.found);
            // The same headers keep the form and the choices already made.
            setFound((before) => (before?.join('\u0000') === headers.join('\u0000') ? before : headers));
          }
        },
        onSettled: () => {
          sending.current = false;
        },
      },
    );
  };

  // The first "wrong columns" answer is what opens the matching step, not a failure to report.
  const firstMismatch = isApiError(upload.error) && upload.error.code === 'wrong_columns' && !upload.variables?.fields;
  const problem = localProblem ?? (upload.isError && !firstMismatch ? uploadProblem(upload.error) : null);
  const busy = upload.isPending;

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-2">
        <label htmlFor={inputId} className="font-semibold text-ink-900">Recording file (CSV)</label>
        <p id={`${inputId}-hint`} className="text-sm text-ink-500">One night, up to {MAX_FILE_MB} MB.</p>
        <input
          id={inputId}
          type="file"
          accept=".csv,text/csv"
          aria-describedby={`${inputId}-hint`}
          onChange={choose}
          disabled={busy}
          className="block w-full rounded-lg border border-surface-300 bg-surface-0 p-2 text-base text-ink-900 file:mr-3 file:min-h-10 file:rounded-md file:border-0 file:bg-brand-50 file:px-3 file:font-semibold file:text-brand-800"
        />
        {file && <p className="text-sm text-ink-700">Chosen: <span className="font-semibold break-all">{file.name}</span> ({fileSizeText(file.size)})</p>}
        <OurFormat />
      </div>
      {problem && <ProblemAlert problem={problem} />}
      {found && saved.isPending ? (
        <p className="text-ink-700">Looking for the columns used last time…</p>
      ) : found ? (
        <ColumnMapping key={found.join('\u0000')} found={found} saved={saved.data ?? null} familyTimeZone={familyTimeZone} busy={busy} onSubmit={send} />
      ) : (
        <div>
          <Button size="lg" onClick={() => send()} disabled={busy} className="w-full sm:w-auto">
            {busy ? 'Uploading…' : 'Upload recording'}
          </Button>
        </div>
      )}
    </div>
  );
}
