import { RECORDING_LIMITS } from '@shared/recordings/limits';
import { isApiError } from '../../../lib/api-error';

export const MAX_FILE_MB = RECORDING_LIMITS.maxFileBytes / (1024 * 1024);

export interface UploadProblem {
  title: string;
  /** The server's own sentence, when it adds something (a line number, the rows it could not read). */
  detail?: string;
}

const TITLES: Record<string, string> = {
  too_large: `This file is larger than ${MAX_FILE_MB} MB. Check that it is a single night’s export.`,
  not_csv: 'This is not a CSV text file. Export the recording as CSV, saved as UTF-8, and choose that file.',
  empty_file: 'This file is empty. Choose the exported recording.',
  malformed_csv: 'This file is not valid CSV.',
  unreadable_rows: 'Too many rows in this file could not be read.',
  too_short: `This recording is too short to analyse (fewer than ${RECORDING_LIMITS.minSamples} readings).`,
  too_long: `This file spans more than ${RECORDING_LIMITS.maxDurationHours} hours. Upload one night at a time.`,
  date_order_unclear: 'Choose the date order: the dates in this file could be read day first or month first.',
  clock_change: 'A time in this file falls on the clock change and cannot be placed.',
  no_file: 'Choose a recording file first.',
  not_multipart: 'The upload did not arrive as a file. Try again.',
  bad_form: 'The upload arrived incomplete. Try again.',
  validation_failed: 'The column choices were not accepted.',
  forbidden: 'Only the coordinator or the baby’s nurse can upload a recording for this baby.',
  not_found: 'This baby is not in your records.',
  unauthenticated: 'Your session has ended. Sign in again, then upload the file.',
  network: 'Nestflow could not be reached. Check the connection and try again.',
};

// Codes whose server message names the exact place in the file, which is worth showing as well.
const WITH_DETAIL = new Set(['malformed_csv', 'unreadable_rows', 'too_short', 'too_long', 'bad_form', 'date_order_unclear', 'clock_change']);

export function uploadProblem(error: unknown): UploadProblem {
  if (!isApiError(error)) return { title: 'The upload failed. Try again in a moment.' };
  const title = TITLES[error.code];
  if (!title) return { title: error.message };
  if (error.code === 'malformed_csv' && error.details?.line?.[0]) {
    return { title: `This file is not valid CSV (line ${error.details.line[0]}).`, detail: error.message };
  }
  if (error.code === 'validation_failed' && error.details) {
    return { title, detail: Object.values(error.details).flat().join(' ') };
  }
  return WITH_DETAIL.has(error.code) ? { title, detail: error.message } : { title };
}

export function fileSizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(0)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
