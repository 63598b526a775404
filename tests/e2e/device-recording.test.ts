import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { axeReport, seriousViolations } from '../helpers/a11y';
import { openBrowser, pageApi, screenshot, signInAndLand, type Browser } from '../helpers/browser';
import { DEVICE_PREAMBLE, deviceExport, type DeviceNight } from '../fixtures/recordings/device-export';

const base = inject('baseUrl');
let browser: Browser;
let page: Page;
const dir = mkdtempSync(path.join(tmpdir(), 'nestflow-e2e-device-'));

beforeAll(async () => {
  browser = await openBrowser({ width: 1366, height: 860 });
  page = browser.page;
});
afterAll(() => browser?.close());

const api = (method: string, p: string, body?: unknown) => pageApi(page)(method, p, body);
/** A night written as an oximeter with its own clock exports it (semicolons, decimal commas, text lines first). */
function exportFile(name: string, night: Partial<DeviceNight>) {
  const file = path.join(dir, name);
  writeFileSync(file, deviceExport({ startUtc: '2026-10-24T21:00:00Z', hours: 9, periodSec: 10, clockZone: 'Europe/London', preamble: DEVICE_PREAMBLE, ...night }));
  return file;
}

async function chooseAndMatch(file: string) {
  await page.getByLabel('Recording file (CSV)').setInputFiles(file);
  await page.getByRole('button', { name: 'Upload recording' }).click();
  const step = page.getByRole('form', { name: 'Match the columns' });
  await step.waitFor();
  return step;
}

// UK clocks went back on Sunday 25 October 2026 at 02:00 BST (01:00 GMT) and forward on Sunday 29 March 2026 at
// 01:00 GMT (Summer Time Order 2002, SI 2002/262). The demo families live in Europe/London.
describe('an oximeter’s own export across a clock change', () => {
  it('when the clock did not follow the change the time is refused in words with its line; a clean night reads as 9 hours; the next file gets the same columns', async () => {
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    const babies = await api('GET', '/api/infants?status=on_oxygen&pageSize=1');
    const infantId = babies.body.items[0].id as string;
    await page.goto(`${base}/infants/${infantId}/recordings/new`);

    // 1. A device that stayed on summer time (a fixed UTC+1 clock) writes 01:00–01:59 once: which pass is unknown.
    let step = await chooseAndMatch(exportFile('stuck-on-summer-time.csv', { clockZone: 'Etc/GMT-1', hours: 8 }));
    expect(await step.getByRole('radio', { name: 'A date column and a time column' }).isChecked()).toBe(true);
    expect(await step.getByLabel('Date', { exact: true }).inputValue()).toBe('Date');
    expect(await step.getByLabel('Time of day').inputValue()).toBe('Time');
    await step.getByRole('button', { name: 'Upload with these columns' }).click();
    const alert = page.getByRole('alert');
    await alert.getByText('A time in this file falls on the clock change and cannot be placed.').waitFor();
    // Header text on lines 1–4, column names on line 5, 22:00 on line 6: 01:00 is 3 h × 360 rows later.
    await alert.getByText(/^Line 1086: 25\/10\/2026 01:00:00 happens twice on this night in Europe\/London \(the clocks went back an hour\)/).waitFor();
    expect(await alert.textContent()).toContain('choose the time zone it keeps (for example UTC) and upload again');
    await screenshot(page, 'device-upload-clock-went-back');
    expect(axeReport(await seriousViolations(page))).toBe('');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'device-upload-clock-went-back-phone');
    expect(axeReport(await seriousViolations(page))).toBe('');
    await page.setViewportSize({ width: 1366, height: 860 });

    // 2. A device that followed the change writes the hour twice; the order of rows places each pass: 9 hours.
    step = await chooseAndMatch(exportFile('followed-the-change.csv', {}));
    await step.getByRole('button', { name: 'Upload with these columns' }).click();
    await page.waitForURL(/\/recordings\/[0-9a-f-]{36}$/);
    const id = page.url().split('/').pop()!;
    const stored = (await api('GET', `/api/recordings/${id}`)).body;
    expect(stored).toMatchObject({ startedAt: '2026-10-24T21:00:00.000Z', durationMinutes: 540, sampleCount: 3240, skippedRows: 0 });
    const length = page.locator('dt', { hasText: 'Length (h:mm)' }).locator('xpath=following-sibling::dd[1]');
    expect(await length.textContent()).toBe('9:00');
    await expect.poll(async () => (await api('GET', `/api/recordings/${id}`)).body.status, { timeout: 30_000 }).toBe('done');
    await screenshot(page, 'device-upload-analysed');

    // 3. The next file with the same column names gets the same choices; this one has a time in the skipped hour.
    await page.goto(`${base}/infants/${infantId}/recordings/new`);
    step = await chooseAndMatch(exportFile('spring-no-change.csv', { startUtc: '2026-03-28T22:00:00Z', hours: 7, clockZone: 'UTC' }));
    await step.getByText('Chosen as for the last file with these columns. Check them before uploading.').waitFor();
    await step.getByRole('button', { name: 'Upload with these columns' }).click();
    await page.getByRole('alert').getByText(/^Line 1086: 29\/03\/2026 01:00:00 does not exist in Europe\/London: the clocks went forward an hour that night\./).waitFor();
    await screenshot(page, 'device-upload-clocks-went-forward');
  });
});
