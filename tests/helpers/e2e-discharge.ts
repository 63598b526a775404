import { execFileSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import type { FakeMailMessage } from '../../fakes/mail/app';

/** The demo programme's supplier order address (seed/seed-policy.ts). */
export const DEMO_SUPPLIER = 'orders@fenwold-gases.example';

/** Text with its runs of white space folded to one space, as PDF text and page text are compared. */
export const spaced = (text: string) => text.replace(/\s+/g, ' ').trim();

/** Ticks one discharge checklist item on the record, with the evidence it asks for, and waits for the saved tick. */
export async function tickItem(page: Page, label: string, evidence?: { date?: string; person?: string }) {
  await page.getByRole('button', { name: `Mark done: ${label}` }).click();
  const form = page.getByRole('form', { name: `Mark done: ${label}` });
  if (evidence?.date) await form.getByLabel('Date it was done').fill(evidence.date);
  if (evidence?.person) await form.getByLabel('Who did it').fill(evidence.person);
  await form.getByRole('button', { name: 'Save as done' }).click();
  await page.getByRole('button', { name: `Undo: ${label}` }).waitFor();
}

/** The supplier's e-mail for an order, as the fake mail server holds it, with the signed link in it. */
export async function supplierMail(fakeMailUrl: string, reference: string, to = DEMO_SUPPLIER): Promise<{ message: FakeMailMessage; link: string }> {
  for (let i = 0; i < 100; i++) {
    const inbox = (await (await fetch(`${fakeMailUrl}/messages`)).json()) as FakeMailMessage[];
    const message = inbox.find((m) => m.envelope.to.includes(to) && m.subject.includes(reference));
    const link = message ? /http\S+\/supplier\/orders\/[A-Za-z0-9._-]+/.exec(message.text)?.[0] : undefined;
    if (message && link) return { message, link };
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no e-mail to ${to} for ${reference}`);
}

/** Clicks a link that downloads a PDF and returns the file name and its text as pdftotext (poppler-utils) reads it. */
export async function downloadPdfText(page: Page, linkName: string): Promise<{ filename: string; text: string }> {
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: linkName }).click()]);
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'nestflow-e2e-')), 'download.pdf');
  await download.saveAs(file);
  return { filename: download.suggestedFilename(), text: spaced(execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' })) };
}
