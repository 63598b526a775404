import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addDays } from '@shared/clinical/dates';
import { dateInWords } from '@shared/dates/date-words';
import { DEFAULT_DISCHARGE_RULES } from '@shared/schemas/discharge-policy';
import { openBrowser, pageApi, screenshot, signOut, signInAndLand, type Browser } from '../helpers/browser';
import { downloadPdfText, supplierMail, tickItem } from '../helpers/e2e-discharge';
import { pdfAttachment, pdfLinks, pdfText } from '../helpers/pdf';

// The whole path in one browser: the checklist, the order to the supplier, the supplier's link from the
// mail fake (no account), the equipment items following the order, the discharge date, the first visit, the PDFs.
const base = inject('baseUrl');
const fakeMail = inject('fakeMailUrl');
let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());
beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    await screenshot(page, `discharge-journey-failed-${task.name.slice(5, 40).replace(/[^a-z0-9]+/gi, '-')}`).catch(() => undefined);
  });
});

const api = (method: string, path: string, body?: unknown) => pageApi(page)(method, path, body);
/** The programme's calendar day: the server runs on the real clock here, and the demo programme is in Europe/London. */
const today = () => new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London', year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date());
const EQUIPMENT_KEYS = ['equipment_ordered', 'equipment_installed'];
const rule = (key: string) => DEFAULT_DISCHARGE_RULES.items.find((r) => r.key === key)!;
const ALL = DEFAULT_DISCHARGE_RULES.items.length;

let baby = { id: '', name: '' };
let reference = '';
let orderPdf = '';
const dischargeOn = addDays(today(), 2);
const discharge = () => page.locator('section', { has: page.getByRole('heading', { level: 2, name: 'Discharge' }) });
const equipment = () => page.locator('section', { has: page.getByRole('heading', { level: 2, name: 'Equipment' }) });

describe('the coordinator takes a baby home with the supplier’s equipment', () => {
  it('when the coordinator works through the checklist on a demo baby not yet started, then every step but the equipment is done by hand', async () => {
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    // A demo baby with an approved setting, nothing ticked, no order and no home visit booked ahead (a booked visit
    // would answer the first-visit proposal); not one of the first five on oxygen, which the demo's discharge
    // stages and the other browser tests use (seed/seed-discharges.ts).
    const list = (await api('GET', '/api/infants?status=on_oxygen&pageSize=50')).body.items as Array<{ id: string; name: string }>;
    for (const candidate of list.slice(5)) {
      const d = (await api('GET', `/api/infants/${candidate.id}/discharge`)).body as { settingApproved: boolean; items: Array<{ done: boolean }> };
      const orders = (await api('GET', `/api/infants/${candidate.id}/equipment-orders`)).body.items as unknown[];
      const visits = (await api('GET', `/api/infants/${candidate.id}/visits`)).body.items as Array<{ kind: string; status: string; date: string }>;
      const visitAhead = visits.some((v) => v.kind === 'home_visit' && v.status === 'booked' && v.date >= today());
      if (d.settingApproved && d.items.every((i) => !i.done) && orders.length === 0 && !visitAhead) {
        baby = candidate;
        break;
      }
    }
    expect(baby.id, 'a demo baby ready to start').not.toBe('');
    await page.goto(`${base}/infants/${baby.id}`);
    await discharge().getByText(`0 of ${ALL} steps done`).waitFor();
    for (const item of DEFAULT_DISCHARGE_RULES.items.filter((i) => !EQUIPMENT_KEYS.includes(i.key))) {
      const evidence = { date: item.evidence.includes('date') ? addDays(today(), -1) : undefined, person: item.evidence.includes('person') ? 'Nurse Tamsin Reed' : undefined };
      await tickItem(page, item.label, evidence);
    }
    await discharge().getByText(`${ALL - 2} of ${ALL} steps done`).waitFor();
    // The equipment items are still open: nothing has been ordered.
    await discharge().getByRole('button', { name: `Mark done: ${rule('equipment_ordered').label}` }).waitFor();
  });

  it('when the coordinator sends an order, then "equipment ordered" is done by it, and the e-mailed PDF reads back', async () => {
    await equipment().getByRole('button', { name: 'Order equipment' }).click();
    const form = page.getByRole('form', { name: 'Order equipment' });
    await form.getByLabel('Lowest flow, L/min (item 1)').fill('0.1');
    await form.getByLabel('Highest flow, L/min (item 1)').fill('2');
    await form.getByLabel('Needed by').fill(addDays(today(), 1));
    await form.getByRole('button', { name: 'Send to the supplier' }).click();
    const sent = equipment().getByRole('list', { name: 'Open equipment orders' }).getByRole('listitem').filter({ hasText: 'Sent, waiting for the supplier' }).first();
    await sent.waitFor();
    reference = (await sent.getAttribute('aria-label'))!.replace('Order ', '');

    await discharge().getByText(`Done by the order sent to the supplier, on ${dateInWords(today())}:`).waitFor();
    await discharge().getByRole('link', { name: `order ${reference}` }).waitFor();
    await discharge().getByText(`${ALL - 1} of ${ALL} steps done`).waitFor();

    const { message, link } = await supplierMail(fakeMail, reference);
    const pdf = pdfAttachment(message);
    expect(pdf, 'the order is attached as a PDF').not.toBeNull();
    orderPdf = await pdfText(pdf!);
    expect(orderPdf).toContain(`Equipment order ${reference}`);
    expect(orderPdf).toContain(`Needed by ${dateInWords(addDays(today(), 1))}`);
    expect(orderPdf).toContain('1 × Oxygen concentrator, flow range 0.1–2 L/min');
    // The mail's signed link is in the PDF too: printed (a long address wraps, so compared without the white space)
    // and clickable as one address.
    expect(orderPdf.replace(/\s/g, '')).toContain(link);
    expect(pdfLinks(pdf!)).toEqual([link]);
  });

  it('when the supplier confirms and delivers through the link in the mail fake, with no session, then the order says delivered', async () => {
    const { link } = await supplierMail(fakeMail, reference);
    await signOut(browser, base);
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(link);
    await page.getByRole('heading', { level: 1, name: `Equipment order ${reference}` }).waitFor();
    await page.getByRole('textbox', { name: 'Delivery date' }).fill(today());
    await page.getByRole('button', { name: 'Confirm the delivery date' }).click();
    await page.getByText('Delivery date confirmed', { exact: true }).waitFor();
    await page.getByRole('button', { name: 'Mark as delivered' }).click();
    await page.getByText('Delivered', { exact: true }).first().waitFor();
    expect((await browser.context.cookies()).map((c) => c.name)).not.toContain('nestflow.sid');
    await page.setViewportSize({ width: 1280, height: 860 });
  });

  it('when the coordinator comes back, then both equipment items are done by the supplier and the baby is ready; the date proposes the first visit', async () => {
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    await page.goto(`${base}/infants/${baby.id}`);
    await discharge().getByText(`Done by the supplier’s delivery, on ${dateInWords(today())}:`).waitFor();
    await discharge().getByText(`${ALL} of ${ALL} steps done`).waitFor();
    await discharge().getByText('Ready to go home: every step is done.').waitFor();
    // Neither equipment item can be undone by hand: they follow the order.
    for (const key of EQUIPMENT_KEYS) expect(await discharge().getByRole('button', { name: `Undo: ${rule(key).label}` }).count()).toBe(0);
    // The link leads to the delivered order in the equipment section.
    await discharge().getByRole('link', { name: `order ${reference}` }).first().click();
    expect(page.url()).toMatch(/#order-[0-9a-f-]{36}$/);

    await discharge().getByRole('button', { name: 'Set discharge date' }).click();
    const form = page.getByRole('form', { name: 'Set discharge date' });
    await form.getByLabel('Discharge date').fill(dischargeOn);
    await form.getByRole('button', { name: 'Save the discharge date' }).click();
    await page.getByText(`Discharge date: ${dateInWords(dischargeOn)}`).waitFor();
    // Default interval: the day after discharge (common practice, shared/schemas/discharge-policy.ts).
    await page.getByText(`First home visit proposed for ${dateInWords(addDays(dischargeOn, 1))}: not booked yet.`).waitFor();
    await screenshot(page, 'discharge-journey-date-set');
  });

  it('when the coordinator downloads the discharge letter, then it reads back the date, the first visit and a complete checklist', async () => {
    const { filename, text } = await downloadPdfText(page, 'Download the discharge letter (PDF)');
    expect(filename).toMatch(/^discharge-letter-[a-z0-9-]+-\d{4}-\d{2}-\d{2}\.pdf$/);
    expect(text).toContain('Home oxygen discharge letter');
    expect(text).toContain(baby.name);
    expect(text).toContain(`Discharge date: ${dateInWords(dischargeOn)}.`);
    expect(text).toContain(`First home visit by the nurse: proposed for ${dateInWords(addDays(dischargeOn, 1))}.`);
    // The equipment items count as done although nobody ticked them: the supplier's delivery did.
    expect(text).toContain('Every step of the programme’s discharge checklist is done.');
  });
});
