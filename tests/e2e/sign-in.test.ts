import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, screenshot, signIn, type Browser } from '../helpers/browser';

const base = inject('baseUrl');
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());

const roles = [
  { email: 'admin@larkmoor.example', path: '/admin', nav: ['Overview', 'People', 'Programme settings'] },
  { email: 'coordinator@larkmoor.example', path: '/coordinator', nav: ['Overview', 'Caseload', 'Enrol a baby'] },
  { email: 'nurse@larkmoor.example', path: '/nurse', nav: ['My day', 'Caseload'] },
  { email: 'consultant@larkmoor.example', path: '/consultant', nav: ['Overview', 'Sign-off queue', 'Caseload'] },
  { email: 'family@larkmoor.example', path: '/family', nav: ['Our plan'] },
];

describe('signing in as each demo role', () => {
  it.each(roles)('when $email signs in, then their own home and navigation show, and sign-out works', async ({ email, path, nav }) => {
    await signIn(browser, base, email);
    await page.waitForURL(`${base}${path}`);
    const navigation = page.getByRole('navigation').first();
    for (const label of nav) await navigation.getByRole('link', { name: label }).first().waitFor();
    if (!email.startsWith('admin')) await expect(navigation.getByRole('link', { name: 'People' }).count()).resolves.toBe(0);
    await screenshot(page, `home-${email.split('@')[0]}`);
    await page.getByRole('button', { name: 'Sign out' }).first().click();
    // Plain sign-in: a deliberate sign-out names no page for the next person at this computer to see.
    await page.waitForURL(`${base}/sign-in`);
    const session = await page.evaluate(() => fetch('/api/session').then((r) => r.json()));
    expect(session.user).toBeNull();
  });

  it('when the password is wrong, then one generic message shows and the e-mail stays typed', async () => {
    await signIn(browser, base, 'nurse@larkmoor.example', 'not-the-password');
    await page.getByText('That e-mail and password do not match an active account.').waitFor();
    await expect(page.getByLabel('E-mail').inputValue()).resolves.toBe('nurse@larkmoor.example');
    await screenshot(page, 'sign-in-wrong-password');
  });

  it('when a phone-sized screen is used, then the family home still fits', async () => {
    await page.setViewportSize({ width: 375, height: 760 });
    await signIn(browser, base, 'family@larkmoor.example');
    await page.waitForURL(`${base}/family`);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, 'home-family-phone');
  });
});
