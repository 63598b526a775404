import { createRecordingParser, type ParsedRecording, type RecordingParseOptions } from '@shared/recordings/recording-parser';
import { problemError, UploadRejectedError } from './upload-errors';

// About 1 MB of text per step: a 20 MB file never holds the event loop for long (docs/service-targets.md P5).
const CHUNK_CHARS = 1 << 20;
const yieldToOthers = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * The bytes must be UTF-8 text. A NUL byte never appears in a text export but is common in binary formats (and
 * in UTF-16, which needs saving as UTF-8 first); the strict decoder refuses any other invalid byte sequence.
 */
export function decodeUploadText(bytes: Uint8Array): string {
  if (bytes.byteLength === 0) throw new UploadRejectedError(400, 'empty_file', 'The file is empty.');
  const notCsv = 'The file is not a CSV text file (it holds binary data or is not UTF-8). Export the recording as CSV, saved as UTF-8.';
  if (bytes.includes(0)) throw new UploadRejectedError(415, 'not_csv', notCsv);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new UploadRejectedError(415, 'not_csv', notCsv);
  }
  if (text.trim() === '') throw new UploadRejectedError(400, 'empty_file', 'The file has no content.');
  return text;
}

/** Parses in steps, yielding between them; any refusal becomes a typed 400 naming the line. */
export async function parseUploadText(text: string, options: RecordingParseOptions): Promise<ParsedRecording> {
  const parser = createRecordingParser(options);
  for (let at = 0; at < text.length; at += CHUNK_CHARS) {
    if (at > 0) await yieldToOthers();
    const problem = parser.push(text.slice(at, at + CHUNK_CHARS));
    if (problem) throw problemError(problem);
  }
  const result = parser.finish();
  if (!result.ok) throw problemError(result.problem);
  return result.recording;
}

/** The client's name for the file, for display only: no folders, no control characters, bounded length. */
export function cleanFileName(name: string | undefined): string {
  const base = (name ?? '').split(/[\\/]/).pop() ?? '';
  const cleaned = base.replace(/\p{Cc}/gu, '').trim().slice(0, 200);
  return cleaned || 'recording.csv';
}
