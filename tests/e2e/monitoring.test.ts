import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openBrowser, pageApi, screenshot, signInAndLand, type Browser } from '../helpers/browser';

const base = inject('baseUrl');
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser({ width: 390, height: 844 });
  page = browser.page;
});
afterAll(() => browser?.close());

const signIn = (email: string) => signInAndLand(browser, base, email);
const api = (method: string, path: string, body?: unknown) => pageApi(page)(method, path, body);


describe('monitoring on a phone', () => {
  it("when the nurse opens a spot check on today's round, then one tap saves the reading and the check stays in its place, marked done", async () => {
    await signIn('nurse@larkmoor.example');
    await page.goto(`${base}/nurse`);
    const day = await api('GET', '/api/my-day');
    // Checks done earlier today stay on the round (marked done); take one still to do.
    const spot = day.body.items.find((i: { kind: string; status: string }) => i.kind === 'spot_check' && i.status !== 'done');
    expect(spot, 'the demo round has a spot check due or overdue').toBeTruthy();
    await page.getByRole('button', { name: new RegExp(spot.infantName) }).first().click();
    await page.getByLabel('SpO2 (%)').fill('94');
    await page.getByLabel('Pulse (/min)').fill('138');
    await page.getByLabel('Asleep').check();
    await screenshot(page, 'nurse-day-reading-form-phone');
    await page.getByRole('button', { name: 'Save reading' }).click();
    const place = (items: Array<{ id: string }>) => items.findIndex((i) => i.id === spot.id);
    const before = place(day.body.items);
    await expect.poll(async () => (await api('GET', '/api/my-day')).body.items.find((i: { id: string }) => i.id === spot.id)?.status, { timeout: 10_000 }).toBe('done');
    // The round keeps its order: the stop is where it was, so the numbers of the others do not move.
    expect(place((await api('GET', '/api/my-day')).body.items)).toBe(before);
    const stop = page.getByRole('list', { name: 'Checks in route order' }).getByRole('listitem').nth(before);
    await expect.poll(async () => stop.textContent(), { timeout: 10_000 }).toMatch(new RegExp(`^${before + 1}${spot.infantName}.*Done.*done at`));
    const readings = await api('GET', `/api/infants/${spot.infantId}/readings`);
    expect(readings.body.items.at(-1)).toMatchObject({ spo2: 94, pulse: 138, state: 'asleep', checkId: spot.id });
    await screenshot(page, 'nurse-day-after-save-phone');
  });

  it('when the nurse asks to step down against unmet rules, then she sees them before sending; the consultant sees the evidence and must give a reason', async () => {
    await signIn('nurse@larkmoor.example');
    const babies = await api('GET', '/api/infants?status=on_oxygen&pageSize=50');
    let chosen: { id: string; unmet: number } | null = null;
    for (const b of babies.body.items as Array<{ id: string }>) {
      const preview = await api('GET', `/api/infants/${b.id}/step-down-checks`);
      const unmet = (preview.body.checks as Array<{ met: boolean }>).filter((c) => !c.met).length;
      if (preview.status === 200 && !preview.body.blockedReason && unmet > 0) {
        chosen = { id: b.id, unmet };
        break;
      }
    }
    expect(chosen, "some baby on the nurse's caseload has step-down rules not yet met").toBeTruthy();
    await page.goto(`${base}/infants/${chosen!.id}`);
    await page.getByRole('button', { name: 'Ask to step down' }).click();
    const rules = page.getByRole('list', { name: 'Step-down rules' });
    await rules.waitFor();
    expect(await page.getByRole('heading', { name: `${chosen!.unmet} of 6 programme rules not met` }).count()).toBe(1);
    await page.getByLabel('Why the baby is ready').fill('Settled on overnight oximetry, feeding and growing well');
    await page.getByRole('button', { name: 'Send to the consultant anyway' }).click();
    await page.getByText('Say in at least 10 characters why the step down should go ahead anyway').first().waitFor();
    await page.getByLabel('Why ask anyway (required)').fill('Consultant asked on the ward round to try the next step now');
    await screenshot(page, 'step-down-ask-anyway-phone');
    await page.getByRole('button', { name: 'Send to the consultant anyway' }).click();
    await page.getByText(/Step down asked for \(version \d+/).waitFor();
    const versions = (await api('GET', `/api/infants/${chosen!.id}/prescriptions`)).body.items as Array<{ id: string; status: string; reason: string; version: number }>;
    const requested = versions.find((v) => v.status === 'proposed' && v.reason === 'step_down')!;
    expect(requested).toBeTruthy();

    await signIn('consultant@larkmoor.example');
    const queue = (await api('GET', '/api/prescriptions/queue')).body.items as Array<{ prescriptionId: string; unmetChecks: number }>;
    expect(queue.find((q) => q.prescriptionId === requested.id)?.unmetChecks).toBe(chosen!.unmet);
    await page.goto(`${base}/sign-off`);
    await page.getByText(`${chosen!.unmet} step-down rule${chosen!.unmet === 1 ? '' : 's'} not met`).first().waitFor();
    await page.goto(`${base}/sign-off/${requested.id}`);
    await page.getByRole('heading', { name: 'Evidence for this step down' }).waitFor();
    await page.getByRole('heading', { name: `Programme rules: ${chosen!.unmet} not met` }).waitFor();
    await page.getByText('Consultant asked on the ward round to try the next step now').waitFor();
    await page.getByText('Settled on overnight oximetry, feeding and growing well').first().waitFor();
    await page.getByRole('link', { name: 'Open the baby’s record' }).waitFor();
    await page.locator('figure canvas').first().waitFor().catch(() => undefined);
    await screenshot(page, 'step-down-evidence-phone');
    await page.getByLabel('Approve as proposed').check();
    await page.getByRole('button', { name: /^Approve/ }).last().click();
    await page.getByText(/step-down rules? (is|are) not met: record why you approve anyway/).first().waitFor();
    expect((await api('GET', `/api/prescriptions/${requested.id}`)).body.status).toBe('proposed');
    await page.getByLabel(/Reason \(required\)/).fill('Reviewed the trace and readings myself; trial of the lower step with a study in a week');
    await page.getByRole('button', { name: /^Approve/ }).last().click();
    await page.waitForURL(`${base}/sign-off`);
    const decided = (await api('GET', `/api/prescriptions/${requested.id}`)).body;
    expect(decided).toMatchObject({ status: 'active', decisionReason: 'Reviewed the trace and readings myself; trial of the lower step with a study in a week' });

    await signIn('nurse@larkmoor.example');
    await page.goto(`${base}/nurse`);
    // The worker re-plans the baby's checks after the approval.
    await expect.poll(async () => (await api('GET', '/api/my-day')).body.upcoming.some((i: { planKey: string }) => i.planKey === `follow-up-v${requested.version}`), { timeout: 20_000 }).toBe(true);
    await page.reload();
    await page.getByText('Coming up this week').waitFor();
    await screenshot(page, 'nurse-day-follow-up-phone');
  });

  it('when the coordinator uploads an overnight CSV, then the summary and the SpO2 trace with events appear without a reload', async () => {
    await page.setViewportSize({ width: 1280, height: 900 });
    await signIn('coordinator@larkmoor.example');
    const babies = await api('GET', '/api/infants?status=on_oxygen&pageSize=1');
    const infantId = babies.body.items[0].id as string;
    // A made-up 8-hour night at 1 Hz in our documented format, with four dips to 84 % and a sensor-off spell.
    const start = Date.parse('2026-11-29T21:00:00Z');
    const rows = ['timestamp,spo2,pulse,status'];
    for (let t = 0; t < 8 * 3600; t++) {
      const dip = [3600, 9000, 15000, 21000].some((d) => t >= d && t < d + 30);
      const off = t >= 12000 && t < 12060;
      rows.push(off ? `${new Date(start + t * 1000).toISOString()},,,sensor off` : `${new Date(start + t * 1000).toISOString()},${dip ? 84 : 96},130,ok`);
    }
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'nestflow-e2e-')), 'overnight-2026-11-29.csv');
    writeFileSync(file, rows.join('\n') + '\n');
    await page.goto(`${base}/infants/${infantId}/recordings/new`);
    await page.getByLabel('Recording file (CSV)').setInputFiles(file);
    await page.getByRole('button', { name: 'Upload recording' }).click();
    await page.waitForURL(/\/recordings\/[0-9a-f-]{36}$/);
    await page.getByText('Meets the overnight target').waitFor({ timeout: 30_000 });
    const id = page.url().split('/').pop()!;
    const stored = await api('GET', `/api/recordings/${id}`);
    expect(stored.body).toMatchObject({ status: 'done', sampleCount: 8 * 3600 });
    expect(stored.body.summary.odi3).toBeCloseTo(4 / (stored.body.summary.validMinutes / 60), 6);
    await page.locator('figure canvas').first().waitFor();
    await page.getByRole('table', { name: /Desaturation events/ }).waitFor();
    await screenshot(page, 'recording-summary-chart');
  });
});

