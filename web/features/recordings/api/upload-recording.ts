import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  RECORDING_UPLOAD_ERRORS,
  recordingAcceptedSchema,
  type RecordingUploadFields,
} from '@shared/schemas/recordings';
import { postForm } from './post-form';
import { recordingKeys } from './recording-keys';
import { ANALYSING_TOAST } from './analysing-toast';

export interface UploadInput {
  file: File;
  /** The column mapping, on a second try after the file's columns were not ours. */
  fields?: RecordingUploadFields;
}

export interface UploadResult {
  id: string;
  /** False when the same file was already uploaded for this baby: the stored recording is reused. */
  created: boolean;
}

export async function uploadRecording(infantId: string, { file, fields }: UploadInput): Promise<UploadResult> {
  const form = new FormData();
  // Fields before the file, so the server has the mapping in hand when it reads the file.
  for (const [key, value] of Object.entries(fields ?? {})) if (value !== undefined) form.append(key, value);
  form.append('file', file, file.name);
  const answer = await postForm(`/api/infants/${encodeURIComponent(infantId)}/recordings`, form, recordingAcceptedSchema);
  return { id: answer.data.id, created: answer.status === 202 };
}

export function useUploadRecording(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadInput) => uploadRecording(infantId, input),
    // Every refusal is explained on the upload page itself, next to the file.
    meta: {
      inlineErrors: [...RECORDING_UPLOAD_ERRORS, 'validation_failed', 'forbidden', 'not_found', 'conflict'],
      successToast: (data) =>
        (data as UploadResult).created ? ANALYSING_TOAST : 'This file was already uploaded for this baby; here it is.',
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recordingKeys.infantLists(infantId) }),
  });
}
