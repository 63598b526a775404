import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { localParts } from '@shared/reminders/timing';
import { addDays } from '@shared/clinical/dates';
import { openBrowser, pageApi, screenshot, signInAndLand, type Browser } from '../helpers/browser';

const base = inject('baseUrl');
const fakeSms = inject('fakeSmsUrl');
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());

const api = (method: string, path: string, body?: unknown) => pageApi(page)(method, path, body);

describe('visit reminders end to end', () => {
  it("when the coordinator books a visit, then the family's reminder reaches the fake SMS inbox and the message log shows it sent", async () => {
    // The admin sets the day-before reminder to this very minute (family's clock) so the test need not wait a day.
    await signInAndLand(browser, base, 'admin@larkmoor.example');
    const policy = (await api('GET', '/api/policy')).body;
    const now = localParts(new Date(), 'Europe/London');
    const settings = { ...policy.settings, reminders: { ...policy.settings.reminders, dayBeforeAt: now.time, quietStart: '00:00', quietEnd: '00:00' } };
    expect((await api('PUT', '/api/policy', { baseVersion: policy.version, settings })).status).toBe(200);

    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    const list = (await api('GET', '/api/infants?status=on_oxygen&pageSize=50')).body.items as Array<{ id: string }>;
    let target: { id: string; givenName: string; contact: { mobile: string; name: string } } | null = null;
    for (const b of list) {
      const detail = (await api('GET', `/api/infants/${b.id}`)).body;
      const c = detail.contacts?.[0];
      if (c?.preferredChannel === 'sms' && c.consentSms && c.mobile && c.timeZone === 'Europe/London') {
        target = { id: b.id, givenName: detail.givenName, contact: c };
        break;
      }
    }
    expect(target, 'a demo baby whose family prefers text messages').toBeTruthy();
    const number = target!.contact.mobile.replace(/[^0-9+]/g, '');

    await page.goto(`${base}/infants/${target!.id}`);
    await page.getByRole('button', { name: 'Book a visit' }).click();
    const form = page.getByRole('form', { name: 'Book a visit' });
    await form.getByLabel('Date').fill(addDays(now.date, 1));
    await form.getByLabel(/^Time/).fill('10:30');
    await form.getByLabel('Who will see the family').selectOption({ index: 1 });
    await form.getByLabel('What it is for').fill('Spot check and weight');
    await screenshot(page, 'reminders-book-visit');
    await form.getByRole('button', { name: 'Book the visit' }).click();

    // The reminder arrives in the fake SMS server's inbox, through the twilio SDK.
    await expect.poll(async () => {
      const messages = (await (await fetch(`${fakeSms}/messages`)).json()) as Array<{ to: string; body: string }>;
      return messages.filter((m) => m.to === number && m.body.includes('tomorrow')).length;
    }, { timeout: 30_000, interval: 500 }).toBeGreaterThan(0);
    const messages = (await (await fetch(`${fakeSms}/messages`)).json()) as Array<{ to: string; body: string; sid: string }>;
    const mine = messages.filter((m) => m.to === number && m.body.includes('tomorrow'));
    expect(mine).toHaveLength(1);
    expect(mine[0].body).toContain(`${target!.givenName} has a home visit tomorrow`);
    expect(mine[0].body).toContain('10:30');

    // The message log shows it sent, with the provider's id.
    await page.goto(`${base}/messages?infantId=${target!.id}`);
    const row = page.getByRole('row').filter({ hasText: mine[0].sid });
    await expect.poll(() => row.count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(async () => (await row.textContent()) ?? '').toMatch(/Sent/);
    await expect.poll(async () => (await row.textContent()) ?? '').toMatch(/Visit tomorrow \(family\)/);
    await screenshot(page, 'reminders-message-log');
  });
});
