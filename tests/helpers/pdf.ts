import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Response } from 'superagent';
import type { FakeMailMessage } from '../../fakes/mail/app';

const run = promisify(execFile);

/** A Supertest parser that keeps a binary answer (a PDF) as one Buffer: `.buffer(true).parse(pdfBody)`. */
export const pdfBody = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

/**
 * A PDF read back as a person copying it would: its text by pdftotext (poppler-utils) with spaces folded, pdfinfo's
 * report and the page count.
 */
export async function readPdf(pdf: Buffer): Promise<{ text: string; info: string; pages: number }> {
  const dir = await mkdtemp(path.join(tmpdir(), 'nestflow-pdf-'));
  try {
    const file = path.join(dir, 'read.pdf');
    await writeFile(file, pdf);
    const { stdout: text } = await run('pdftotext', ['-layout', file, '-']);
    const { stdout: info } = await run('pdfinfo', [file]);
    return { text: text.replace(/\s+/g, ' '), info, pages: Number(/Pages:\s+(\d+)/.exec(info)?.[1]) };
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** The text of a PDF, spaces folded (see readPdf). */
export const pdfText = async (pdf: Buffer): Promise<string> => (await readPdf(pdf)).text;

/**
 * The web addresses a PDF's link annotations open (`/URI (…)` in its object dictionaries, which pdfkit writes
 * uncompressed), each once, with the literal string's escapes undone.
 */
export function pdfLinks(pdf: Buffer): string[] {
  const uris = [...pdf.toString('latin1').matchAll(/\/URI \(((?:\\.|[^\\)])*)\)/g)].map((m) => m[1].replace(/\\(.)/g, '$1'));
  return [...new Set(uris)];
}

/** The PDF attached to an e-mail, as bytes (base64 part of the raw message). */
export function pdfAttachment(message: FakeMailMessage): Buffer | null {
  const part = /Content-Type: application\/pdf[^\r\n]*(?:\r?\n[^\r\n]+)*\r?\n\r?\n([A-Za-z0-9+/=\r\n]+)/.exec(message.raw);
  return part ? Buffer.from(part[1].replace(/\s+/g, ''), 'base64') : null;
}
