import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addDays } from '@shared/clinical/dates';
import { dateInWords } from '@shared/dates/date-words';
import { LETTER_CAUTIONS } from '@shared/discharge/letter-text';
import { axeReport, headingSkips, seriousViolations } from '../helpers/a11y';
import { openBrowser, screenshot, signInAndLand, type Browser } from '../helpers/browser';
import { downloadPdfText, spaced, tickItem } from '../helpers/e2e-discharge';

const base = inject('baseUrl');
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());
beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    await screenshot(page, `discharge-failed-${task.name.slice(5, 40).replace(/[^a-z0-9]+/gi, '-')}`).catch(() => undefined);
  });
});

/** The programme's calendar day (the demo programme is in Europe/London). */
const today = () => new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London', year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date());

let recordUrl = '';
let babyName = '';
const dischargeOn = addDays(today(), 2);

const tick = (label: string, evidence?: { date: string; person: string }) => tickItem(page, label, evidence);

describe('the coordinator takes a baby home: checklist, discharge date, first visit, letter', () => {
  it('when the overview lists a baby in preparation, then the coordinator opens its record from the list of what is missing', async () => {
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    await page.goto(`${base}/coordinator`);
    const list = page.getByRole('list', { name: 'Babies going home' });
    // The demo's part-done baby: three steps left (seed/seed-discharges.ts).
    const item = list.getByRole('listitem').filter({ hasText: '3 steps missing' });
    await expect(item.textContent()).resolves.toContain('Home assessed for oxygen safety; Working smoke alarms in the home; Discharge letter sent to the community team');
    const link = item.getByRole('link');
    babyName = (await link.textContent())!.trim();
    await link.click();
    await page.waitForURL(/\/infants\/[0-9a-f-]{36}$/);
    recordUrl = page.url();
    await page.getByRole('heading', { name: 'Discharge' }).waitFor();
    await page.getByText('13 of 16 steps done').waitFor();
  });

  it('when the coordinator ticks two steps and tries to set the date, then the one step left is named in words', async () => {
    await tick('Home assessed for oxygen safety', { date: addDays(today(), -1), person: 'Nurse Tamsin Reed' });
    await tick('Working smoke alarms in the home');
    await page.getByRole('button', { name: 'Set discharge date' }).click();
    const form = page.getByRole('form', { name: 'Set discharge date' });
    // No override box for a coordinator: only a consultant may go on with a step missing.
    await expect(form.getByLabel(/Reason to set the date/).count()).resolves.toBe(0);
    await form.getByLabel('Discharge date').fill(dischargeOn);
    await form.getByRole('button', { name: 'Save the discharge date' }).click();
    await form.getByText('Not ready to go home. Still to do: Discharge letter sent to the community team.').first().waitFor();
    await form.getByRole('button', { name: 'Cancel' }).click();
  });

  it('when every step is done and the date set, then the first home visit is proposed the day after (the policy default)', async () => {
    await tick('Discharge letter sent to the community team');
    await page.getByText('Ready to go home: every step is done.').waitFor();
    await page.getByRole('button', { name: 'Set discharge date' }).click();
    const form = page.getByRole('form', { name: 'Set discharge date' });
    await form.getByLabel('Discharge date').fill(dischargeOn);
    await form.getByRole('button', { name: 'Save the discharge date' }).click();
    await page.getByText(`Discharge date: ${dateInWords(dischargeOn)}`).waitFor();
    // Default interval 1 day (common practice, shared/schemas/discharge-policy.ts).
    await page.getByText(`First home visit proposed for ${dateInWords(addDays(dischargeOn, 1))}: not booked yet.`).waitFor();
    await screenshot(page, 'discharge-record-date-set');
    // The record with the discharge section open: no serious axe finding, no skipped heading level.
    await page.getByRole('button', { name: 'Set discharge date' }).or(page.getByRole('button', { name: 'Change discharge date' })).first().click();
    expect(axeReport(await seriousViolations(page))).toBe(axeReport([]));
    expect(await headingSkips(page)).toEqual([]);
  });

  it('when the coordinator downloads the discharge letter, then its text reads back with the date, the first visit, the targets and the cautions', async () => {
    await page.goto(recordUrl);
    const { filename, text } = await downloadPdfText(page, 'Download the discharge letter (PDF)');
    expect(filename).toMatch(/^discharge-letter-[a-z0-9-]+-\d{4}-\d{2}-\d{2}\.pdf$/);
    expect(text).toContain('Home oxygen discharge letter');
    expect(text).toContain(babyName);
    expect(text).toContain(`Discharge date: ${dateInWords(dischargeOn)}.`);
    expect(text).toContain(`First home visit by the nurse: proposed for ${dateInWords(addDays(dischargeOn, 1))}.`);
    expect(text).toContain('Every step of the programme’s discharge checklist is done.');
    // Programme default targets (shared/schemas/policy.ts: TSANZ 2020 / BTS 2009; ATS 2019 for spot readings).
    expect(text).toContain('mean SpO2 93% or more');
    expect(text).toContain('A steady spot reading of 90% or less is low.');
    for (const caution of LETTER_CAUTIONS) expect(text).toContain(spaced(caution).slice(0, 30));
  });

  it('when the overview is opened again, then the baby is listed with its date and nothing missing', async () => {
    await page.goto(`${base}/coordinator`);
    const item = page.getByRole('list', { name: 'Babies going home' }).getByRole('listitem').filter({ hasText: babyName });
    await item.getByText('Every step done').waitFor();
    await expect(item.textContent()).resolves.toContain('goes home');
  });
});
