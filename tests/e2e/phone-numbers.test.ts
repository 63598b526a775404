import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addDays } from '../../shared/clinical/dates';
import { localParts } from '../../shared/reminders/timing';
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

describe('a family number typed in national form', () => {
  it('when the family enters 07700 900123 and a visit is booked, then the booking note reaches the SMS service addressed to +447700900123', async () => {
    // No quiet hours, so the note goes at once whatever the hour the suite runs (their timing is tested at fixed
    // instants in tests/shared/reminders and tests/api/visit-booking-note.test.ts).
    await signInAndLand(browser, base, 'admin@larkmoor.example');
    const policy = (await api('GET', '/api/policy')).body;
    const settings = { ...policy.settings, reminders: { ...policy.settings.reminders, quietStart: '00:00', quietEnd: '00:00' } };
    expect((await api('PUT', '/api/policy', { baseVersion: policy.version, settings })).status).toBe(200);

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
});
