import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, pageApi, screenshot, signOut, signInAndLand, type Browser } from '../helpers/browser';
import { axeReport, headingSkips, seriousViolations } from '../helpers/a11y';
import { supplierMail } from '../helpers/e2e-discharge';

const base = inject('baseUrl');
const fakeMail = inject('fakeMailUrl');
let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());

const api = (method: string, path: string, body?: unknown) => pageApi(page)(method, path, body);
// The server runs on the real clock here: dates a few days ahead keep every step inside the link's life.
const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

async function linkFor(reference: string): Promise<string> {
  const { message, link } = await supplierMail(fakeMail, reference);
  expect(message.raw).toMatch(/Content-Type: application\/pdf/);
  return link;
}

describe('an equipment order from the coordinator to the supplier and back', () => {
  it('when the coordinator sends an order, then the supplier confirms a date and the delivery through the e-mailed link, and the record shows it', async () => {
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    const list = await api('GET', '/api/infants?status=on_oxygen&pageSize=5');
    const baby = list.body.items[list.body.items.length - 1] as { id: string; name: string };

    await page.goto(`${base}/infants/${baby.id}`);
    const section = page.locator('section', { has: page.getByRole('heading', { level: 2, name: 'Equipment' }) });
    await section.getByRole('button', { name: 'Order equipment' }).click();
    const form = page.getByRole('form', { name: 'Order equipment' });
    await form.getByLabel('Lowest flow, L/min (item 1)').fill('0.1');
    await form.getByLabel('Highest flow, L/min (item 1)').fill('2');
    await form.getByLabel('Needed by').fill(inDays(4));
    await form.getByRole('button', { name: 'Send to the supplier' }).click();
    const sent = section.getByRole('list', { name: 'Open equipment orders' }).getByRole('listitem').filter({ hasText: 'Sent, waiting for the supplier' }).first();
    await sent.waitFor();
    const reference = (await sent.getAttribute('aria-label'))!.replace('Order ', '');

    const link = await linkFor(reference);
    // The supplier has no account: a fresh start with no cookies at all.
    await signOut(browser, base);
    // The supplier reads it on a phone: axe finds nothing serious there, and the headings do not skip.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(link);
    await page.getByRole('heading', { level: 1, name: `Equipment order ${reference}` }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(axeReport(await seriousViolations(page))).toBe('');
    expect(await headingSkips(page)).toEqual([]);
    expect(await page.title()).toBe(`Order ${reference} · Nestflow`);
    expect(await page.getByText('1 × Oxygen concentrator, flow range 0.1–2 L/min').count()).toBe(1);
    await page.getByRole('textbox', { name: 'Delivery date' }).fill(inDays(3));
    await page.getByRole('button', { name: 'Confirm the delivery date' }).click();
    await page.getByText('Delivery date confirmed', { exact: true }).waitFor();
    await page.getByRole('button', { name: 'Mark as delivered' }).click();
    await page.getByText('Delivered', { exact: true }).first().waitFor();
    await screenshot(page, 'supplier-order-delivered');
    // No session was ever made for the supplier (the app shell's signed-out CSRF cookie is all it may hold).
    expect((await browser.context.cookies()).map((c) => c.name)).not.toContain('nestflow.sid');

    await page.setViewportSize({ width: 1280, height: 860 });
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    // The programme's list, reached from the overview's figure: the seeded order never confirmed by its date is flagged.
    await page.goto(`${base}/equipment-orders?status=open`);
    await page.getByRole('heading', { level: 1, name: 'Equipment orders' }).waitFor();
    await page.getByRole('cell').getByText('Not confirmed by the date needed').first().waitFor();
    await page.waitForLoadState('networkidle');
    expect(axeReport(await seriousViolations(page))).toBe('');
    await page.goto(`${base}/infants/${baby.id}`);
    await section.getByText(/^Delivered and cancelled orders/).click();
    const done = section.getByRole('listitem', { name: `Order ${reference}` });
    await done.getByText('Delivered', { exact: true }).waitFor();
    await done.getByText(`Status history of ${reference}`).click();
    expect(await done.getByText(/Delivered \(Supplier\)/).count()).toBe(1);
    expect(await done.getByText(/Delivery date confirmed \(Supplier\)/).count()).toBe(1);
  });
});
