import { MulterError } from 'multer';
import type { RecordingProblem } from '@shared/recordings/recording-parser';
import { RECORDING_LIMITS } from '@shared/recordings/limits';
import type { RecordingUploadError } from '@shared/schemas/recordings';
import { AppError, type FieldErrors } from '../../lib/errors';

/** A refused upload: its code tells the web which step to offer (pick another file, map the columns…). */
export class UploadRejectedError extends AppError {
  constructor(status: 400 | 413 | 415, code: RecordingUploadError, message: string, details?: FieldErrors) {
    super(status, code, message, details);
  }
}

const MB = RECORDING_LIMITS.maxFileBytes / (1024 * 1024);

/** Multer reports limits and broken forms as its own errors; each becomes a readable 4xx, never a 500. */
export function uploadErrorFrom(err: unknown): unknown {
  if (!(err instanceof MulterError)) {
    // Busboy's own complaints (a cut-off or mis-framed body, a client that gave up) arrive as plain errors.
    const message = (err as Error)?.message ?? '';
    if (/Unexpected end of (form|file)|Malformed part header|Boundary not found|Request (aborted|closed)/i.test(message)) {
      return new UploadRejectedError(400, 'bad_form', 'The upload form arrived incomplete or malformed. Please try again.');
    }
    return err;
  }
  switch (err.code) {
    case 'LIMIT_FILE_SIZE':
      return new UploadRejectedError(413, 'too_large', `The file is larger than ${MB} MB, the most one overnight recording may be. Check that it is a single night's export.`);
    case 'LIMIT_FILE_COUNT':
    case 'LIMIT_UNEXPECTED_FILE':
      return new UploadRejectedError(400, 'bad_form', 'Send exactly one file, in the form field named "file".');
    default:
      return new UploadRejectedError(400, 'bad_form', `The upload form has too many or too long fields (${err.message.toLowerCase()}).`);
  }
}

export function problemError(problem: RecordingProblem): UploadRejectedError {
  const details: FieldErrors = { ...(problem.details ?? {}) };
  if (problem.line !== undefined) details.line = [String(problem.line)];
  return new UploadRejectedError(400, problem.code, problem.message, Object.keys(details).length ? details : undefined);
}
