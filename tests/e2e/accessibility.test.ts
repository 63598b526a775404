import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { axeReport, axeViolations, focused, headingSkips, isSerious, nestedLiveRegions, ringClippedBy, tabThroughPage } from '../helpers/a11y';
import { openBrowser, pageApi, screenshot, signOut, signIn, signInAndLand, type Browser } from '../helpers/browser';
import { supplierMail } from '../helpers/e2e-discharge';

// WCAG 2.2 AA checks on the five flows named in the accessibility issue, and axe on every page for every role.
const base = inject('baseUrl');
const fakeMail = inject('fakeMailUrl');
const DESKTOP = { width: 1280, height: 860 };
const PHONE = { width: 390, height: 844 };
// A 1280 × 860 window at 200 % zoom lays the page out as 640 × 430 CSS pixels.
const ZOOM_200 = { width: 640, height: 430 };

let browser: Browser;
let page: Page;
const stamp = Date.now().toString(36);
const babyName = `Linnet Coldharbour${stamp.slice(-3)}`;

beforeAll(async () => {
  browser = await openBrowser(DESKTOP);
  page = browser.page;
});
afterAll(() => browser?.close());
beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    await screenshot(page, `a11y-failed-${task.name.slice(5, 40).replace(/[^a-z0-9]+/gi, '-')}`).catch(() => undefined);
  });
});

const api = (method: string, url: string, body?: unknown) => pageApi(page)(method, url, body);
const land = (email: string) => signInAndLand(browser, base, email);

interface Row { page: string; who: string; screen: string; title: string; total: number; serious: number; critical: number; ids: string }
// Every axe scan of this file, for the table printed at the end (and kept in artifacts/axe-totals.md).
const rows: Row[] = [];

/** Axe on the page as it is now (an error state in a flow); serious or critical findings fail the test. */
async function expectAxeClean(label: string, who: string, screenName: string) {
  const found = await axeViolations(page);
  rows.push({ page: label, who, screen: screenName, title: await page.title(), total: found.length, serious: found.filter((v) => v.impact === 'serious').length, critical: found.filter((v) => v.impact === 'critical').length, ids: found.map((v) => `${v.id}(${v.impact})`).join(' ') });
  const serious = found.filter(isSerious);
  expect(serious, `${label}\n${axeReport(serious)}`).toEqual([]);
}

async function expectTitle(title: string) {
  await expect.poll(() => page.title(), { timeout: 10_000 }).toBe(title);
}

async function expectFocusOnHeading(name: string | RegExp) {
  await expect.poll(async () => {
    const now = await focused(page);
    return now?.isPageHeading ? now.text : `not the h1: ${JSON.stringify(now)}`;
  }, { timeout: 10_000 }).toMatch(typeof name === 'string' ? new RegExp(`^${name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`) : name);
}

async function expectFocusOnErrorSummary(): Promise<string> {
  await expect.poll(async () => (await focused(page))?.isErrorSummary ?? false, { timeout: 10_000 }).toBe(true);
  return (await focused(page))!.text;
}

async function expectNothingCovered(label: string) {
  const { stops, covered } = await tabThroughPage(page);
  expect(stops, `${label}: the page has stops to tab through`).toBeGreaterThan(3);
  expect(covered, `${label}: focused controls under the bottom menu`).toEqual([]);
  return stops;
}

describe('keyboard, screen reader and zoom: the five flows', () => {
  it('sign-in: the title and focus follow each step, a failed sign-in focuses the error summary, the home heading takes focus after sign-in', async () => {
    await signOut(browser, base);
    await page.goto(`${base}/sign-in`);
    await expectTitle('Sign in · Nestflow');
    await expectFocusOnHeading('Sign in');

    await page.getByRole('button', { name: 'Sign in' }).click();
    const empty = await expectFocusOnErrorSummary();
    expect(empty).toContain('There is a problem');
    const summary = page.getByRole('region', { name: 'There is a problem' });
    // Each problem is a link to its field: following the second reaches the password box.
    await summary.getByRole('link').nth(1).click();
    expect(await page.evaluate(() => (document.activeElement as HTMLInputElement).type)).toBe('password');

    await signIn(browser, base, 'coordinator@larkmoor.example', 'not-the-password');
    expect(await expectFocusOnErrorSummary()).toContain('That e-mail and password do not match an active account.');
    await screenshot(page, 'a11y-sign-in-error-summary');
    await expectAxeClean('/sign-in (refused, error summary)', 'signed out', 'desktop');

    await land('coordinator@larkmoor.example');
    await page.waitForURL(`${base}/coordinator`);
    await expectTitle('Overview · Nestflow');
    await expectFocusOnHeading('Overview');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Caseload' }).click();
    await expectTitle('Caseload · Nestflow');
    await expectFocusOnHeading('Caseload');
    // Sorting changes only the query string: focus stays on the sort button.
    const sort = page.locator('th button').first();
    // Reached with the keyboard, so the browser draws the focus ring (:focus-visible).
    await sort.focus();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    expect(await ringClippedBy(page), 'the sort button\'s focus ring is whole').toEqual([]);
    await page.keyboard.press('Enter');
    await page.waitForURL(/sort=/);
    expect((await focused(page))?.tag).toBe('button');

    await page.setViewportSize(ZOOM_200);
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Caseload' }).waitFor();
    await page.waitForLoadState('networkidle');
    await expectNothingCovered('caseload at 200 %');
    await screenshot(page, 'a11y-caseload-200');
    await page.setViewportSize(DESKTOP);
  });

  it('enrolment: "Next" with a problem focuses the summary, its link reaches the field, a good step focuses the next step, enrolling focuses the record', async () => {
    await page.goto(`${base}/enrol`);
    await expectTitle('Enrol a baby · Nestflow');
    await expectFocusOnHeading('Enrol a baby');
    const [given, family] = babyName.split(' ');
    // Everything on the first step but the given name.
    await page.getByLabel('Family name').fill(family);
    await page.getByLabel('Sex').selectOption('female');
    await page.getByLabel('Birth date').fill('2026-08-10');
    await page.getByLabel('Weeks').fill('28');
    await page.getByLabel('Days').fill('2');
    await page.getByLabel('Birth weight (g)').fill('1100');
    await page.getByLabel('Current weight (kg)').fill('3.1');
    await page.getByLabel('Weighed on').fill('2026-11-28');
    await page.getByLabel('Chronic lung disease').check();
    await page.getByRole('button', { name: /^Next/ }).click();
    const text = await expectFocusOnErrorSummary();
    expect(text).toContain('Given name');
    await screenshot(page, 'a11y-enrol-step-error');
    await expectAxeClean('/enrol (step 1 error summary)', 'coordinator', 'desktop');
    await page.getByRole('region', { name: 'There is a problem' }).getByRole('link', { name: /Given name/ }).click();
    await expect.poll(() => page.evaluate(() => (document.activeElement as HTMLInputElement).name)).toBe('baby.givenName');
    await page.keyboard.type(given);
    for (const step of await page.getByRole('navigation', { name: 'Enrolment steps' }).getByRole('button').all()) {
      await step.focus();
      expect(await ringClippedBy(page), `the focus ring of step "${await step.textContent()}" is whole`).toEqual([]);
    }

    await page.getByRole('button', { name: /^Next/ }).click();
    await expect.poll(async () => (await focused(page))?.text ?? '').toMatch(/^Step 2 of \d/);
    expect(await page.getByRole('region', { name: 'There is a problem' }).count()).toBe(0);

    // The second step's "Next" with nothing filled in: the summary lists this step's problems.
    await page.getByRole('button', { name: /^Next/ }).click();
    expect(await expectFocusOnErrorSummary()).toMatch(/Hospital site|Cannula flow/);
    const site = page.getByLabel('Hospital site');
    await site.locator('option', { hasText: 'Larkmoor Regional' }).waitFor({ state: 'attached' });
    await site.selectOption((await site.locator('option', { hasText: 'Larkmoor Regional' }).getAttribute('value'))!);
    await page.getByLabel('Cannula flow in hospital (L/min)').fill('0.25');
    await page.getByLabel('Wall or cylinder oxygen (100 %)').check();
    await page.getByRole('button', { name: /^Next/ }).click();
    await page.getByLabel('Home address').fill('9 Kiln Lane, Wrenbrook');
    await page.getByLabel('Home elevation (m)').fill('610');
    await page.getByLabel('Cylinder (100 %)').check();
    await page.getByRole('button', { name: /^Next/ }).click();
    for (const [label, person] of [['Home-care nurse', 'Tobias Fenwright'], ['Consultant', 'Dr Helena Marchbank']]) {
      const select = page.getByLabel(label, { exact: true });
      const option = select.locator('option', { hasText: person });
      await option.waitFor({ state: 'attached' });
      await select.selectOption((await option.getAttribute('value'))!);
    }
    await page.getByLabel('Name', { exact: true }).fill('Maren Coldharbour');
    await page.getByLabel('Relation to the baby').fill('Mother');
    await page.getByLabel('Mobile number').fill('+44 7700 900556');
    await page.getByLabel('SMS', { exact: true }).check();
    await page.getByLabel('Agrees to SMS').check();
    await page.getByRole('button', { name: /^Next/ }).click();
    await page.getByRole('button', { name: 'Enrol baby' }).click();
    await page.waitForURL(/\/infants\/[0-9a-f-]{36}$/);
    await expectTitle(`Record · ${babyName} · Nestflow`);
    await expectFocusOnHeading(babyName);
    await page.getByText('Waiting for consultant sign-off').waitFor({ timeout: 20_000 });
  });

  it('sign-off: the queue link names start with their words, "Go to the decision" moves focus, the working scrolls by keyboard at 200 %, deciding focuses the queue heading', async () => {
    await land('consultant@larkmoor.example');
    await page.goto(`${base}/sign-off`);
    await expectTitle('Sign-off queue · Nestflow');
    await expectFocusOnHeading('Sign-off queue');
    // WCAG 2.5.3: every review link's spoken name starts with the words on it.
    const mismatched = await page.evaluate(() =>
      [...document.querySelectorAll<HTMLElement>('main a[aria-label], main button[aria-label]')]
        .filter((el) => !el.getAttribute('aria-label')!.toLowerCase().startsWith((el.textContent ?? '').replace(/\s+/g, ' ').trim().toLowerCase()))
        .map((el) => `${el.textContent} → ${el.getAttribute('aria-label')}`));
    expect(mismatched).toEqual([]);

    await page.getByRole('link', { name: `Review proposal for ${babyName}` }).click();
    await expectTitle(`Sign off · ${babyName} · Nestflow`);
    await expectFocusOnHeading('Review a proposal');
    await page.getByText('Checks and working').waitFor();
    await page.getByRole('link', { name: 'Go to the decision' }).click();
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('decision');

    await page.setViewportSize(ZOOM_200);
    await page.waitForTimeout(300);
    // Anything that scrolls sideways can be reached and scrolled with the keyboard.
    const unreachable = await page.evaluate(() =>
      [...document.querySelectorAll<HTMLElement>('main *')]
        .filter((el) => ['auto', 'scroll'].includes(getComputedStyle(el).overflowX) && el.scrollWidth > el.clientWidth + 1)
        .filter((el) => el.tabIndex < 0 && !el.querySelector('a[href], button, input, select, textarea, [tabindex="0"]'))
        .map((el) => el.outerHTML.slice(0, 80)));
    expect(unreachable).toEqual([]);
    await expectAxeClean('/sign-off/:id (200 % zoom)', 'consultant', '640 × 430');
    await screenshot(page, 'a11y-sign-off-review-200');
    await page.setViewportSize(DESKTOP);

    await page.getByLabel('Approve as proposed').check();
    await page.getByRole('button', { name: /^Approve \d/ }).click();
    await page.waitForURL(`${base}/sign-off`);
    await expectTitle('Sign-off queue · Nestflow');
    await expectFocusOnHeading('Sign-off queue');
  });

  it("nurse's reading on a phone: nothing hides under the menu, an empty save focuses the summary, its links reach every field, a save focuses the saved panel", async () => {
    await page.setViewportSize(PHONE);
    await land('nurse@larkmoor.example');
    await page.waitForURL(`${base}/nurse`);
    await expectTitle('My day · Nestflow');
    await expectFocusOnHeading('My day');
    await page.waitForLoadState('networkidle');
    await expectNothingCovered('my day on a phone');

    const card = page.locator('main li button[aria-expanded="false"]').first();
    const who = ((await card.locator('span.text-lg').first().textContent()) ?? '').trim();
    // The card clips its content (rounded corners), so its ring is drawn inside the edge: it must not be cut off.
    await card.focus();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    expect(await ringClippedBy(page), 'the day card\'s focus ring is whole').toEqual([]);
    const cardBox = (await card.boundingBox())!;
    await page.screenshot({ path: 'artifacts/screenshots/a11y-nurse-card-focus-ring-phone.png', clip: { x: 0, y: Math.max(0, cardBox.y - 12), width: PHONE.width, height: cardBox.height + 24 } });
    await card.click();
    await page.getByRole('button', { name: 'Save reading' }).click();
    await expectFocusOnErrorSummary();
    const links = page.getByRole('region', { name: 'There is a problem' }).getByRole('link');
    expect(await links.count()).toBeGreaterThanOrEqual(2);
    await screenshot(page, 'a11y-nurse-reading-errors-phone');
    await expectAxeClean('/nurse (reading form, error summary)', 'nurse', 'phone');
    // The second problem is reached from the summary, not only by tabbing.
    await links.nth(1).click();
    expect(await page.evaluate(() => Boolean(document.activeElement?.closest('[aria-invalid="true"]')))).toBe(true);
    await expectNothingCovered('the open reading form on a phone');

    await page.getByLabel('SpO2 (%)').fill('95');
    await page.getByLabel('Pulse (/min)').fill('140');
    await page.getByLabel('Awake').check();
    await page.getByRole('button', { name: 'Save reading' }).click();
    await expect.poll(async () => (await focused(page))?.text ?? '').toContain(`Saved for ${who}`);
    expect(await headingSkips(page)).toEqual([]);
    await screenshot(page, 'a11y-nurse-reading-saved-phone');
    await expectAxeClean('/nurse (reading saved)', 'nurse', 'phone');
  });

  it('family preferences on a phone: title, heading focus, nothing under the menu, a refused e-mail focuses the summary, a save focuses the confirmation', async () => {
    await land('family@larkmoor.example');
    await page.waitForURL(`${base}/family`);
    await expectFocusOnHeading('Our plan');
    await expect.poll(() => page.title()).toMatch(/^Our plan · .+ · Nestflow$/);
    await page.getByRole('link', { name: 'Contact details and reminders' }).click();
    await expectTitle('Contact details and reminders · Nestflow');
    await expectFocusOnHeading('Contact details and reminders');
    await page.waitForLoadState('networkidle');
    await expectNothingCovered('family preferences on a phone');

    const email = page.getByLabel('E-mail address');
    const kept = await email.inputValue();
    await email.fill('not an address');
    await page.getByRole('button', { name: 'Save my choices' }).click();
    expect(await expectFocusOnErrorSummary()).toContain('E-mail address');
    await screenshot(page, 'a11y-family-preferences-error-phone');
    await expectAxeClean('/family/preferences (error summary)', 'family', 'phone');
    await email.fill(kept || 'family@larkmoor.example');
    await page.getByRole('button', { name: 'Save my choices' }).click();
    await expect.poll(async () => (await focused(page))?.text ?? '').toContain('Saved — we have noted this change');
    await screenshot(page, 'a11y-family-preferences-saved-phone');
    await expectAxeClean('/family/preferences (saved)', 'family', 'phone');
  });
});

describe('axe on every page, staff and family, desktop and phone', () => {
  it('when each page is opened by its role on a desktop and on a phone, then axe finds nothing serious or critical and each page has its own title', async () => {
    await page.setViewportSize(DESKTOP);
    // The scanner itself must be able to fail: a page with an unnamed image and an unlabelled box is reported.
    await page.setContent('<!doctype html><html lang="en"><title>check</title><main><img src="x.png"><input type="text"></main></html>');
    expect((await axeViolations(page)).filter(isSerious).map((v) => v.id).sort()).toEqual(['image-alt', 'label']);
    await land('coordinator@larkmoor.example');
    const babies = (await api('GET', '/api/infants?pageSize=50')).body.items as Array<{ id: string; name: string; status: string }>;
    const baby = babies.find((b) => b.status === 'on_oxygen') ?? babies[0];
    const recordings = (await api('GET', `/api/infants/${baby.id}/recordings`)).body?.items ?? [];
    const journeys = (await api('GET', `/api/infants/${baby.id}/journeys`)).body?.items ?? [];
    const anyJourney = journeys[0] ?? null;
    // An order sent to the supplier for this baby: its record then shows the discharge and equipment sections with
    // an order, and the supplier's page (no session) is reached through the link in the e-mail, as the supplier does.
    const neededBy = new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 10);
    const sent = await api('POST', `/api/infants/${baby.id}/equipment-orders`, { items: [{ kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 2 }], neededBy });
    expect(sent.status, JSON.stringify(sent.body)).toBe(201);
    const supplierPage = new URL((await supplierMail(fakeMail, sent.body.order.reference)).link).pathname;
    await land('consultant@larkmoor.example');
    const queue = (await api('GET', '/api/prescriptions/queue')).body?.items ?? [];
    const waitingJourneys = (await api('GET', '/api/journeys/waiting')).body?.items ?? [];

    const pages: Record<string, string[]> = {
      'admin@larkmoor.example': ['/admin', '/admin/people', '/admin/settings', '/messages', '/equipment-orders'],
      'coordinator@larkmoor.example': [
        '/coordinator', '/caseload', '/enrol', '/messages', `/infants/${baby.id}`, '/equipment-orders', '/equipment-orders?status=overdue', `/infants/${baby.id}/reading`,
        `/infants/${baby.id}/recordings/new`, `/infants/${baby.id}/cylinder`, `/infants/${baby.id}/journeys/new`,
        ...(recordings[0] ? [`/recordings/${recordings[0].id}`] : []),
        ...(anyJourney ? [`/journeys/${anyJourney.id}`] : []),
        '/no-such-page', '/admin/people',
      ],
      'nurse@larkmoor.example': ['/nurse', '/caseload'],
      'consultant@larkmoor.example': [
        '/consultant', '/sign-off', '/caseload', `/infants/${baby.id}`,
        ...(queue[0] ? [`/sign-off/${queue[0].prescriptionId ?? queue[0].id}`] : []),
        ...(waitingJourneys[0] ? [`/journeys/${waitingJourneys[0].id}`] : []),
      ],
      'family@larkmoor.example': ['/family', '/family/cylinder', '/family/journey', '/family/preferences'],
    };

    const problems: string[] = [];
    const scan = async (who: string, url: string, screenName: string) => {
      await page.goto(`${base}${url}`);
      await page.locator('h1').first().waitFor({ timeout: 15_000 });
      await page.waitForLoadState('networkidle');
      await expect.poll(() => page.title()).not.toBe('Nestflow');
      const title = await page.title();
      const found = await axeViolations(page);
      const serious = found.filter((v) => v.impact === 'serious');
      const critical = found.filter((v) => v.impact === 'critical');
      rows.push({ page: url.replace(/\/supplier\/orders\/\S+/, '/supplier/orders/:token').replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, ':id'), who: who.split('@')[0], screen: screenName, title, total: found.length, serious: serious.length, critical: critical.length, ids: found.map((v) => `${v.id}(${v.impact})`).join(' ') });
      if (serious.length + critical.length) problems.push(`${who} ${url} ${screenName}\n${axeReport([...critical, ...serious])}`);
      if (!/ · Nestflow$/.test(title)) problems.push(`${who} ${url} ${screenName}: title "${title}"`);
      const skips = await headingSkips(page);
      if (skips.length) problems.push(`${who} ${url} ${screenName}: heading levels skip: ${skips.join('; ')}`);
      const nested = await nestedLiveRegions(page);
      if (nested.length) problems.push(`${who} ${url} ${screenName}: live regions inside live regions: ${nested.join('; ')}`);
      const heading = await focused(page);
      if (!heading?.isPageHeading) problems.push(`${who} ${url} ${screenName}: focus not on the h1 after loading (${JSON.stringify(heading)})`);
    };

    for (const [screenName, viewport] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
      await page.setViewportSize(viewport);
      await signOut(browser, base);
      await scan('signed out', '/sign-in', screenName);
      await scan('supplier (signed link, no session)', supplierPage, screenName);
      for (const [who, urls] of Object.entries(pages)) {
        await land(who);
        for (const url of urls) await scan(who, url, screenName);
      }
    }

    const table = [
      '| page | signed in as | screen | title | axe findings | serious | critical | rules (impact) |',
      '| --- | --- | --- | --- | --- | --- | --- | --- |',
      ...rows.map((r) => `| ${r.page} | ${r.who} | ${r.screen} | ${r.title} | ${r.total} | ${r.serious} | ${r.critical} | ${r.ids || '—'} |`),
    ].join('\n');
    console.log(`\nAxe totals per page (${rows.length} scans)\n${table}\n`);
    mkdirSync('artifacts', { recursive: true });
    writeFileSync(path.join('artifacts', 'axe-totals.md'), `${table}\n`);
    expect(rows.filter((r) => !r.page.includes('(')).length).toBeGreaterThan(40);
    expect(problems, problems.join('\n\n')).toEqual([]);
  }, 600_000);
});
