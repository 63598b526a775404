import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { FakeMailMessage } from '../../fakes/mail/app';
import type { AppDeps } from '../../server/deps';

export const SUPPLIER_EMAIL = 'orders@oxygen-supplier.test';

/** Gives the programme a supplier (and a number to call), as an admin would in the settings. */
export async function withSupplier(deps: AppDeps, programmeId: string, over: { orderEmail?: string; lendsOximeter?: boolean } = {}) {
  const current = await deps.repos.policies.current(programmeId);
  const settings = {
    ...current.settings,
    contacts: { ...current.settings.contacts, phones: [{ label: 'Home oxygen team', number: '+441632960001', when: 'Weekdays 08:00–18:00' }] },
    supplier: { name: 'Fenwold Medical Gases', orderEmail: over.orderEmail ?? SUPPLIER_EMAIL, phone: '+441632960002', lendsOximeter: over.lendsOximeter ?? false },
  };
  await deps.repos.policies.insertVersion(programmeId, current.version + 1, settings, null);
  return settings;
}

/** The token of the supplier's link in an order e-mail. */
export function supplierToken(message: FakeMailMessage): string {
  const match = /\/supplier\/orders\/([A-Za-z0-9._-]+)/.exec(message.text);
  if (!match) throw new Error(`no supplier link in: ${message.text}`);
  return match[1];
}

/** The PDF attached to an e-mail, as bytes (base64 part of the raw message). */
export function pdfAttachment(message: FakeMailMessage): Buffer | null {
  const part = /Content-Type: application\/pdf[^\r\n]*(?:\r?\n[^\r\n]+)*\r?\n\r?\n([A-Za-z0-9+/=\r\n]+)/.exec(message.raw);
  return part ? Buffer.from(part[1].replace(/\s+/g, ''), 'base64') : null;
}

const run = promisify(execFile);
/** The text of a PDF as pdftotext (poppler-utils) reads it, spaces folded. */
export async function pdfText(pdf: Buffer): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), 'order-pdf-'));
  try {
    const file = path.join(dir, 'order.pdf');
    await writeFile(file, pdf);
    const { stdout } = await run('pdftotext', ['-layout', file, '-']);
    return stdout.replace(/\s+/g, ' ');
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
