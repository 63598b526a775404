import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, pageApi, screenshot, signOut, signInAndLand as landIn, type Browser } from '../helpers/browser';

const base = inject('baseUrl');
const fakeMail = inject('fakeMailUrl');
let browser: Browser;
let page: Page;
const stamp = Date.now().toString(36);
const familyEmail = `family-${stamp}@larkmoor.example`;
const babyName = `Juniper Ashvale${stamp.slice(-3)}`;
const familyPassword = 'iris picks her own words';
let infantId = '';

beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());

// Each step of the journey starts only once the sign-in has landed on a home page.
const signInAndLand = (email: string, password?: string) => landIn(browser, base, email, password);
const api = (method: string, path: string, body?: unknown) => pageApi(page)(method, path, body);


const next = () => page.getByRole('button', { name: /^Next/ }).click();

describe('enrolment to an approved plan the family can read', () => {
  it('when the admin invites a family member, then the e-mailed link lets them choose their own password', async () => {
    await signInAndLand('admin@larkmoor.example');
    const res = await api('POST', '/api/users', { email: familyEmail, name: 'Iris Ashvale', role: 'family' });
    expect(res.status).toBe(202);
    expect(JSON.stringify(res.body)).not.toMatch(/password/i);
    let link: string | undefined;
    for (let i = 0; i < 100 && !link; i++) {
      const inbox = (await (await fetch(`${fakeMail}/messages`)).json()) as Array<{ envelope: { to: string[] }; text: string }>;
      link = inbox.filter((m) => m.envelope.to.includes(familyEmail)).map((m) => /http\S+\/set-password\?token=[A-Za-z0-9_-]+/.exec(m.text)?.[0]).find(Boolean);
      if (!link) await new Promise((r) => setTimeout(r, 100));
    }
    expect(link).toBeDefined();
    await signOut(browser, base);
    await page.goto(link!);
    await page.getByText('Hello Iris Ashvale').waitFor();
    await page.getByLabel('New password').fill(familyPassword);
    await page.getByLabel('The same password again').fill(familyPassword);
    await screenshot(page, 'set-password');
    await page.getByRole('button', { name: 'Save my password' }).click();
    await page.waitForURL(/\/sign-in\?passwordSet=1$/);
  });

  it('when the coordinator enrols a baby living at 1,780 m, then the proposal appears on the record without a reload', async () => {
    await signInAndLand('coordinator@larkmoor.example');
    await page.goto(`${base}/enrol`);
    const [given, family] = babyName.split(' ');
    await page.getByLabel('Given name').fill(given);
    await page.getByLabel('Family name').fill(family);
    await page.getByLabel('Sex').selectOption('female');
    await page.getByLabel('Birth date').fill('2026-08-02');
    await page.getByLabel('Weeks').fill('27');
    await page.getByLabel('Days').fill('4');
    await page.getByLabel('Birth weight (g)').fill('1010');
    await page.getByLabel('Current weight (kg)').fill('2.9');
    await page.getByLabel('Weighed on').fill('2026-11-28');
    await page.getByLabel('Chronic lung disease').check();
    await next();
    const site = page.getByLabel('Hospital site');
    await site.locator('option', { hasText: 'Larkmoor Regional' }).waitFor({ state: 'attached' });
    await site.selectOption((await site.locator('option', { hasText: 'Larkmoor Regional' }).getAttribute('value'))!);
    await page.getByLabel('Cannula flow in hospital (L/min)').fill('0.25');
    await page.getByLabel('Wall or cylinder oxygen (100 %)').check();
    await next();
    await page.getByLabel('Home address').fill('4 Quarry Row, Cindermoor');
    await page.getByLabel('Home elevation (m)').fill('1780');
    await page.getByLabel('Cylinder (100 %)').check();
    await next();
    for (const [label, person] of [['Home-care nurse', 'Tobias Fenwright'], ['Consultant', 'Dr Helena Marchbank']]) {
      const select = page.getByLabel(label, { exact: true });
      const option = select.locator('option', { hasText: person });
      await option.waitFor({ state: 'attached' });
      await select.selectOption((await option.getAttribute('value'))!);
    }
    await page.getByLabel('Name', { exact: true }).fill('Iris Ashvale');
    await page.getByLabel('Relation to the baby').fill('Mother');
    await page.getByLabel('Mobile number').fill('+44 7700 900555');
    await page.getByLabel('E-mail address').fill(familyEmail);
    await page.getByLabel('SMS', { exact: true }).check();
    await page.getByLabel('Agrees to SMS').check();
    await screenshot(page, 'enrol-care-step');
    await next();
    await screenshot(page, 'enrol-check-step');
    await page.getByRole('button', { name: 'Enrol baby' }).click();
    await page.waitForURL(/\/infants\/[0-9a-f-]{36}$/);
    infantId = page.url().split('/').pop()!;
    await page.getByText('Waiting for consultant sign-off').waitFor({ timeout: 20_000 });
    await screenshot(page, 'infant-record-proposed');
  });

  it('when the consultant opens the proposal, then the working is shown line by line and approving makes it the plan', async () => {
    await signInAndLand('consultant@larkmoor.example');
    await page.goto(`${base}/sign-off`);
    await page.getByRole('link', { name: `Review proposal for ${babyName}` }).click();
    await page.getByText('Checks and working').waitFor();
    const workingRows = await page.locator('table tbody tr').count();
    expect(workingRows).toBeGreaterThan(8);
    await screenshot(page, 'sign-off-review');
    await page.getByLabel('Approve as proposed').check();
    await page.getByRole('button', { name: /^Approve \d/ }).click();
    await page.waitForURL(`${base}/sign-off`);
    const versions = await api('GET', `/api/infants/${infantId}/prescriptions`);
    expect(versions.body.items[0]).toMatchObject({ status: 'active' });
  });

  it('when the family signs in, then they see the approved flow in plain words and cannot open any other baby', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await signInAndLand(familyEmail, familyPassword);
    await page.waitForURL(`${base}/family`);
    const versions = await api('GET', `/api/infants/${infantId}/prescriptions`);
    const flow = versions.body.items[0].approvedFlowLpm as number;
    await page.getByText(`${flow} litres per minute`, { exact: false }).first().waitFor();
    await screenshot(page, 'family-plan-phone');
    const others = await api('GET', '/api/infants');
    expect(others.body.items.map((i: { id: string }) => i.id)).toEqual([infantId]);
    const seeded = await api('GET', '/api/infants/00000000-0000-4000-8000-000000000001');
    expect(seeded.status).toBe(404);
    await page.goto(`${base}/caseload`);
    await page.getByText('Not part of your work').waitFor();
  });
});
