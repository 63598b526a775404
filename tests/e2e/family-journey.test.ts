import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { cylinderTime } from '@shared/clinical/cylinder-time';
import { addDays } from '@shared/clinical/dates';
import {
  OXYGEN_SAFETY_POINTS, WARNING_SIGNS, emergencyCallText, flowInWords, flowText, periodLines,
} from '@shared/family/care-text';
import { JOURNEY_PERIODS } from '@shared/schemas/journeys';
import { homeFlowsOf } from '@shared/clinical/journey-plan';
import { axeReport as report, seriousViolations as seriousOn } from '../helpers/a11y';
import { openBrowser, pageApi, screenshot, signInAndLand, type Browser } from '../helpers/browser';

const base = inject('baseUrl');

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser({ width: 390, height: 844 });
  page = browser.page;
});
afterAll(() => browser?.close());
// A failed step leaves a picture of what the family saw, beside the others.
beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    await screenshot(page, `family-journey-failed-${task.name.slice(5, 40).replace(/[^a-z0-9]+/gi, '-')}`).catch(() => undefined);
  });
});

const signIn = (email: string) => signInAndLand(browser, base, email);
const api = (method: string, url: string, body?: unknown) => pageApi(page)(method, url, body);

// Fictional programme numbers (the UK's drama range, never a real line) so the family page has numbers to show.
const PHONES = [
  { label: 'Home oxygen nurses', number: '+44 (0)1632 960 123', when: 'Weekdays 08:00–18:00, for questions about the oxygen or a visit' },
  { label: 'Children’s ward, out of hours', number: '01632 960 456', when: 'Evenings, nights and weekends' },
];
// As typed above; stored in E.164 and shown to families in the national form (GB programme).
const SHOWN: Record<string, string> = { 'Home oxygen nurses': '01632 960123', 'Children’s ward, out of hours': '01632 960456' };
// Its own name each run, so a re-run against the same database never finds an earlier trip.
const DESTINATION = `Port Callowmere ${Date.now().toString(36).slice(-4).toUpperCase()}`;
const HOURS_AWAY = 9;

interface Baby { id: string; name: string }
interface Plan { approvedFlowLpm: number; periods: Record<'awake' | 'asleep' | 'feeding', number> | null }
let baby: Baby;
let plan: Plan;
let emergencyNumber = '';
let journeyId = '';

/** The programme's calendar day, as the server checks journey dates against it. */
function todayIn(timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date());
}

/** Written here on its own, not borrowed from the page's code: whole minutes, rounded down, as a family reads them. */
function hoursAndMinutes(minutes: number): string {
  const whole = Math.floor(minutes + 1e-9);
  const [h, m] = [Math.floor(whole / 60), whole % 60];
  const unit = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  if (h === 0) return unit(m, 'minute');
  return m === 0 ? unit(h, 'hour') : `${unit(h, 'hour')} and ${unit(m, 'minute')}`;
}

/** The distinct flows the approved plan uses, highest first; off parts of the day use no cylinder. */
function flowsInUse(p: Plan): number[] {
  const flows = p.periods ? JOURNEY_PERIODS.map((k) => p.periods![k]) : [p.approvedFlowLpm];
  return [...new Set(flows.filter((f) => f > 0))].sort((a, b) => b - a);
}

const spaced = (text: string) => text.replace(/\s+/g, ' ').trim();

describe('a family on a phone: plan, cylinder time, a flight check, the printed plan', () => {
  it('when the admin has entered the programme\'s numbers, then the family reads the approved plan, who to call, the warning signs and oxygen safety', async () => {
    await signIn('admin@larkmoor.example');
    const policy = await api('GET', '/api/policy');
    const settings = { ...policy.body.settings, contacts: { ...policy.body.settings.contacts, phones: PHONES } };
    const saved = await api('PUT', '/api/policy', { baseVersion: policy.body.version, settings });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    emergencyNumber = settings.contacts.emergencyNumber;

    await signIn('family@larkmoor.example');
    await page.waitForURL(`${base}/family`);
    const babies = await api('GET', '/api/infants');
    expect(babies.body.items).toHaveLength(1);
    baby = babies.body.items[0];
    const versions = await api('GET', `/api/infants/${baby.id}/prescriptions`);
    plan = versions.body.items.find((rx: { status: string }) => rx.status === 'active');
    expect(plan?.approvedFlowLpm, 'the demo family\'s baby has an approved plan').toBeGreaterThan(0);

    await page.getByRole('heading', { name: 'Our plan', level: 1 }).waitFor();
    await page.getByText(`For ${baby.name}`).waitFor();
    const planCard = page.locator('section', { has: page.getByRole('heading', { name: 'Home oxygen plan' }) });
    for (const flow of flowsInUse(plan)) {
      await planCard.getByText(`${flow} ${flow === 1 ? 'litre' : 'litres'} per minute`).first().waitFor();
    }
    await page.getByRole('complementary', { name: 'Keep your baby safe' }).waitFor();

    // Below the emergency, the setting and the visits, the rest of the page is folded under its heading.
    const unfold = (title: string) => page.getByRole('button', { name: new RegExp(`^${title}`) }).click();
    await unfold('Who to call');
    const calls = page.getByRole('list', { name: 'Numbers to call' });
    await calls.waitFor();
    for (const phone of PHONES) {
      const link = calls.getByRole('link', { name: `Call ${phone.label} on ${SHOWN[phone.label]}` });
      await link.waitFor();
      expect(await link.getAttribute('href')).toMatch(/^tel:\+?[0-9]+$/);
      await calls.getByText(phone.when).waitFor();
    }
    await page.getByText(emergencyCallText(emergencyNumber)).waitFor();
    expect(await page.getByRole('link', { name: `Call the emergency number, ${emergencyNumber}` }).getAttribute('href')).toBe(`tel:${emergencyNumber}`);

    await unfold('Warning signs that need help now');
    await unfold('Oxygen safety at home');
    const signs = page.getByRole('list', { name: 'Warning signs' }).getByRole('listitem');
    expect(await signs.allTextContents()).toEqual([...WARNING_SIGNS]);
    const safety = page.getByRole('list', { name: 'Oxygen safety at home' }).getByRole('listitem');
    expect(await safety.allTextContents()).toEqual([...OXYGEN_SAFETY_POINTS]);
    await screenshot(page, 'family-journey-1-plan-phone');
  });

  it('when the family reads a cylinder gauge, then the time shown is what the shared cylinder-time method gives', async () => {
    // Anchor for the method itself: E cylinder factor 0.28 L/psi, 2000 psi, residual 200 psi, 2 L/min → 252 min
    // (docs/clinical-sources.md §7 check value, formula and factor from the Virginia EMS cylinder guidance sheet).
    expect(cylinderTime({ cylinder: { contentLitres: 0.28 * 2200, fullPressure: 2200, residualPressure: 200 }, gauge: 2000, flowLpm: 2, reservePercent: 0 }).minutesTotal).toBeCloseTo(252, 9);

    await page.getByRole('button', { name: /^How long will a cylinder last\?/ }).click();
    await page.getByRole('link', { name: 'Work out cylinder time' }).click();
    await page.waitForURL(/\/family\/cylinder/);
    const supply = (await api('GET', '/api/policy')).body.settings.supply as {
      cylinders: Array<{ id: string; name: string; contentLitres: number; unit: string; fullPressure: number; residualPressure: number }>;
      reservePercent: number;
    };
    const cylinder = supply.cylinders.find((c) => c.id === 'large-home') ?? supply.cylinders[0];
    expect(cylinder, 'the programme lists cylinders').toBeTruthy();
    const gauge = Math.round(cylinder.fullPressure * 0.7);

    await page.getByLabel('Which cylinder?').selectOption(cylinder.id);
    await page.getByLabel(/What does the gauge read\?/).fill(String(gauge));
    await page.getByRole('button', { name: 'Work out how long it lasts' }).click();
    const result = page.getByRole('list', { name: 'How long it lasts' });
    await result.waitFor();
    for (const flow of flowsInUse(plan)) {
      const time = cylinderTime({ cylinder, gauge, flowLpm: flow, reservePercent: supply.reservePercent });
      const item = result.getByRole('listitem').filter({ hasText: `At ${flow} ${flow === 1 ? 'litre' : 'litres'} per minute` });
      await expect.poll(async () => spaced((await item.textContent()) ?? '')).toContain(
        `Lasts about ${hoursAndMinutes(time.minutesTotal!)}, until the gauge reads ${cylinder.residualPressure} ${cylinder.unit}.`,
      );
      expect(spaced((await item.textContent()) ?? '')).toContain(`Change it or plan a refill before ${hoursAndMinutes(time.minutesBeforeReserve!)} from now`);
    }
    await screenshot(page, 'family-journey-2-cylinder-phone');
  });

  it('when the family asks for a flight check, then the page says it waits for the consultant and shows no numbers yet', async () => {
    await page.getByRole('link', { name: 'Back to our plan' }).click();
    await page.getByRole('button', { name: /^Trips/ }).click();
    await page.getByRole('link', { name: 'Ask for a trip check' }).click();
    await page.waitForURL(/\/family\/journey/);
    const session = (await api('GET', '/api/session')).body;
    const today = todayIn(session.user.programmeTimeZone);
    await page.getByLabel('By air').check();
    await page.getByLabel('Where are you going?').fill(DESTINATION);
    await page.getByLabel('Leaving on').fill(addDays(today, 2));
    await page.getByLabel('Back home on').fill(addDays(today, 6));
    await page.getByLabel('Hours away from your home oxygen supply').fill(String(HOURS_AWAY));
    await screenshot(page, 'family-journey-3-flight-form-phone');
    await page.getByRole('button', { name: 'Send to the consultant' }).click();
    await page.getByRole('heading', { name: 'Sent: waiting for the consultant' }).waitFor();
    await page.getByText(`The trip to ${DESTINATION}`, { exact: false }).waitFor();
    await screenshot(page, 'family-journey-3-sent-phone');

    const journeys = await api('GET', `/api/infants/${baby.id}/journeys`);
    const asked = journeys.body.items.find((j: { request: { destinationName: string } }) => j.request.destinationName === DESTINATION);
    expect(asked).toMatchObject({ status: 'waiting', plan: null, request: { mode: 'flight', departOn: addDays(today, 2), returnOn: addDays(today, 6), hoursAway: HOURS_AWAY } });
    journeyId = asked.id;

    await page.getByRole('link', { name: 'Back to our plan' }).last().click();
    await page.getByRole('button', { name: /^Trips/ }).click();
    await page.getByRole('list', { name: 'Your trips' }).getByText(`Your trip to ${DESTINATION}`, { exact: false }).waitFor();
    expect(await page.getByRole('list', { name: 'Your trips' }).textContent()).toContain('waiting for the consultant to check it');
  });

  it('when the consultant approves the flight check from the sign-off page, then it leaves the waiting list', async () => {
    await signIn('consultant@larkmoor.example');
    await page.goto(`${base}/sign-off`);
    const waiting = page.locator('section', { has: page.getByRole('heading', { name: 'Journey checks waiting' }) });
    await waiting.getByRole('link', { name: `Review journey: ${baby.name}, trip to ${DESTINATION}` }).click();
    await page.waitForURL(`${base}/journeys/${journeyId}`);
    await page.getByText('PROPOSAL — not approved', { exact: false }).waitFor();
    await page.getByLabel('Approve the journey plan').check();
    await screenshot(page, 'family-journey-4-review-phone');
    await page.getByRole('button', { name: 'Approve', exact: true }).click();
    await page.waitForURL(`${base}/sign-off`);
    await page.getByRole('heading', { name: 'Journey checks waiting' }).waitFor();
    await expect.poll(() => waiting.getByRole('link', { name: `Review journey: ${baby.name}, trip to ${DESTINATION}` }).count()).toBe(0);
    const decided = await api('GET', `/api/journeys/${journeyId}`);
    expect(decided.body.journey.status).toBe('approved');
  });

  it('when the family opens their page again, then the trip plan shows the flow there and the cylinders to take', async () => {
    await signIn('family@larkmoor.example');
    await page.waitForURL(`${base}/family`);
    const { journey } = (await api('GET', `/api/journeys/${journeyId}`)).body;
    // Two days ahead, the trip is folded under its name; opened, it shows in full.
    await page.getByRole('button', { name: new RegExp(`^Your trip to ${DESTINATION}`) }).click();
    const trip = page.getByRole('region', { name: `Your trip to ${DESTINATION}` });
    await trip.waitFor();
    // A flight with no higher destination is planned for the cabin only; the card must not read as a new home setting.
    expect(journey.plan.destination.kind).toBe('aircraft-cabin');
    await trip.getByText('On the flight:', { exact: true }).waitFor();
    await trip.getByText('Only for the trip: at home, keep to your usual setting.').waitFor();
    const flows = (journey.plan.periods as Array<{ flowLpm: number | null }>).map((p) => p.flowLpm);
    expect(flows.every((f) => f !== null), 'a flight at 8,000 ft stays within the cannula for the demo baby').toBe(true);
    for (const flow of new Set(flows)) await trip.getByText(`${flow} ${flow === 1 ? 'litre' : 'litres'} per minute`, { exact: false }).first().waitFor();
    const take = trip.getByRole('list', { name: 'Cylinders to take' }).getByRole('listitem');
    const expected = (journey.plan.cylinders as Array<{ name: string; count: number | null }>).filter((c) => c.count !== null && c.count > 0);
    expect(expected.length).toBeGreaterThan(0);
    expect((await take.allTextContents()).map(spaced)).toEqual(expected.map((c) => `${c.count} × ${c.name}`));
    await screenshot(page, 'family-journey-5-trip-plan-phone');
  });

  it('when the family downloads the care plan, then the PDF has a safe name, the approved flow as printed and the trip', async () => {
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download care plan (PDF)' }).click(),
    ]);
    const name = download.suggestedFilename();
    expect(name).toMatch(/^[A-Za-z0-9][A-Za-z0-9._-]*\.pdf$/);
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'nestflow-care-plan-')), name);
    await download.saveAs(file);
    expect(readFileSync(file).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = spaced(execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }));
    const line = (flow: number) => (flow === 0 ? 'off (no oxygen)' : `${flowText(flow)}: ${flowInWords(flow)}`);
    // One line when awake, asleep and feeding share the flow, else one per part of the day.
    const flows = homeFlowsOf(plan.approvedFlowLpm, plan.periods);
    for (const l of periodLines(JOURNEY_PERIODS.map((period) => ({ period, flowLpm: flows[period] })))) expect(text).toContain(`${l.label}: ${line(l.flowLpm)}`);
    // The plan prints the approved trip leaving soonest; ours leaves in 2 days, before any demo trip of the family's.
    expect(text).toContain(`Approved journey: ${DESTINATION}`);
    for (const phone of PHONES) expect(text).toContain(SHOWN[phone.label]);
  });

  it('when axe checks each family page, then none has a serious or critical violation', async () => {
    const pages: Array<[string, () => Promise<void>]> = [
      ['/family', async () => {
        await page.getByRole('button', { name: new RegExp(`^Your trip to ${DESTINATION}`) }).click();
        await page.getByRole('region', { name: `Your trip to ${DESTINATION}` }).waitFor();
      }],
      ['/family/cylinder', async () => {
        await page.getByLabel('Which cylinder?').selectOption({ index: 1 });
        await page.getByLabel(/What does the gauge read\?/).fill('50');
        await page.getByRole('button', { name: 'Work out how long it lasts' }).click();
        await page.getByRole('list', { name: 'How long it lasts' }).waitFor();
      }],
      ['/family/journey', async () => {
        // With the form's own messages showing, so the error state is checked too.
        await page.getByRole('button', { name: 'Send to the consultant' }).click();
        await page.getByRole('region', { name: 'There is a problem' }).waitFor();
      }],
      ['/family/preferences', () => page.getByRole('heading', { name: 'Contact details and reminders', level: 1 }).waitFor()],
    ];
    const failures: string[] = [];
    for (const [url, ready] of pages) {
      await page.goto(`${base}${url}`);
      await ready();
      const serious = await seriousOn(page);
      if (serious.length) failures.push(`${url}\n${report(serious)}`);
      await screenshot(page, `family-journey-7-axe${url.replaceAll('/', '-')}`);
    }
    expect(failures, failures.join('\n\n')).toEqual([]);
  });
});
