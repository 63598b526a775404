import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addDays } from '@shared/clinical/dates';
import { localParts } from '@shared/reminders/timing';
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

/**
 * No quiet hours, so a booking note goes at once whatever the hour the suite runs (their timing is tested at fixed
 * instants in tests/shared/reminders and tests/api/visit-booking-note.test.ts).
 */
async function withoutQuietHours() {
  await signInAndLand(browser, base, 'admin@larkmoor.example');
  const policy = (await api('GET', '/api/policy')).body;
  if (policy.settings.reminders.quietStart === policy.settings.reminders.quietEnd) return;
  const settings = { ...policy.settings, reminders: { ...policy.settings.reminders, quietStart: '00:00', quietEnd: '00:00' } };
  expect((await api('PUT', '/api/policy', { baseVersion: policy.version, settings })).status).toBe(200);
}

describe('a family number typed in national form', () => {
  it('when the family enters 07700 900123 and a visit is booked, then the booking note reaches the SMS service addressed to +447700900123', async () => {
    await withoutQuietHours();
    await signInAndLand(browser, base, 'family@larkmoor.example');
    await page.goto(`${base}/family/preferences`);
    const form = page.getByRole('form', { name: 'Contact details and reminders' });
    await form.getByLabel('Mobile number').fill('07700 900123');
    await form.getByLabel('Text message', { exact: true }).check();
    await form.getByLabel('Text messages', { exact: true }).check();
    await form.getByRole('button', { name: 'Save my choices' }).click();
    // Saved, and shown back as the family wrote it (national form), not as stored.
    await expect.poll(async () => (await api('GET', '/api/me/preferences')).body.preferences.mobile, { timeout: 10_000 }).toBe('+447700900123');
    await expect.poll(() => form.getByLabel('Mobile number').inputValue()).toBe('07700 900123');
    await screenshot(page, 'phone-preferences-saved');
    const babyId = ((await api('GET', '/api/infants?pageSize=5')).body.items[0] as { id: string }).id;
    const baby = (await api('GET', `/api/infants/${babyId}`)).body as { id: string; givenName: string };
    expect(baby.givenName).toBeTruthy();

    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    const nurse = ((await api('GET', '/api/users?role=nurse&pageSize=5')).body.items as Array<{ id: string }>)[0];
    const today = localParts(new Date(), 'Europe/London').date;
    const booked = await api('POST', `/api/infants/${baby.id}/visits`, {
      kind: 'home_visit', date: addDays(today, 2), time: '11:15', durationMinutes: 45, staffId: nurse.id, purpose: 'Weight and spot check',
    });
    expect(booked.status).toBe(201);

    // Through the twilio SDK to the fake SMS service: E.164, never the spaced national form.
    const toFamily = async () => ((await (await fetch(`${fakeSms}/messages`)).json()) as Array<{ to: string; body: string; sid: string }>)
      .filter((m) => m.body.includes(`${baby.givenName} is booked for`) && m.body.includes('11:15'));
    await expect.poll(async () => (await toFamily()).length, { timeout: 30_000, interval: 500 }).toBeGreaterThan(0);
    const notes = await toFamily();
    expect(notes.map((m) => m.to)).toEqual(['+447700900123']);

    // The message log shows the number as people here write it.
    await page.goto(`${base}/messages?infantId=${baby.id}&q=07700%20900123`);
    const row = page.getByRole('row').filter({ hasText: notes[0].sid });
    await expect.poll(() => row.count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(async () => (await row.textContent()) ?? '').toContain('07700 900123');
    await screenshot(page, 'phone-message-log');
  });

  it('when a family message has failed, then at 1366 px the log fits its frame with the baby and "Send again" in view, and at 390 px it still reads', async () => {
    await withoutQuietHours();
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    let babyId = '';
    for (const b of (await api('GET', '/api/infants?status=on_oxygen&pageSize=50')).body.items as Array<{ id: string }>) {
      const c = (await api('GET', `/api/infants/${b.id}`)).body.contacts?.[0];
      if (c?.preferredChannel === 'sms' && c.consentSms && c.mobile) {
        babyId = b.id;
        break;
      }
    }
    expect(babyId, 'a demo baby whose family prefers text messages').toBeTruthy();
    const nurse = ((await api('GET', '/api/users?role=nurse&pageSize=5')).body.items as Array<{ id: string }>)[0];
    // The SMS service refuses the next message (4xx): the booking note fails and waits for the coordinator.
    await fetch(`${fakeSms}/fail`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: '4xx', count: 1 }) });
    const today = localParts(new Date(), 'Europe/London').date;
    expect((await api('POST', `/api/infants/${babyId}/visits`, {
      kind: 'clinic_review', date: addDays(today, 3), time: '09:40', durationMinutes: 30, staffId: nurse.id, purpose: 'Review',
    })).status).toBe(201);
    await expect.poll(async () => (await api('GET', `/api/messages?infantId=${babyId}&status=failed`)).body.total, { timeout: 30_000, interval: 500 }).toBeGreaterThan(0);

    await page.setViewportSize({ width: 1366, height: 860 });
    await page.goto(`${base}/messages?status=failed`);
    // The frame becomes a scrollable region only when the table overflows it.
    const table = page.getByRole('table');
    await table.waitFor();
    const fits = await table.evaluate((t) => t.parentElement!.scrollWidth <= t.parentElement!.clientWidth + 1);
    expect(fits, 'the table fits its frame at 1366 px').toBe(true);
    const send = page.getByRole('button', { name: /^Send again/ }).first();
    const box = (await send.boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(1366);
    await expect.poll(() => page.getByRole('row').nth(1).getByRole('link').count()).toBe(1);
    await screenshot(page, 'messages-1366');

    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${base}/messages?status=failed`);
    await table.waitFor();
    await screenshot(page, 'messages-390');
    await page.setViewportSize({ width: 1280, height: 860 });
  });
});
