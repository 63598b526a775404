import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openBrowser, pageApi, signInAndLand, type Browser } from '../helpers/browser';
import { fhirProblems } from '../helpers/fhir-validate';

const base = inject('baseUrl');
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser();
  page = browser.page;
});
afterAll(() => browser?.close());

describe('Download as FHIR', () => {
  it('when the coordinator downloads a baby’s record as FHIR, then the file is named by the Nestflow id and holds a valid R4 Bundle of that baby', async () => {
    await signInAndLand(browser, base, 'coordinator@larkmoor.example');
    const list = await pageApi(page)('GET', '/api/infants?pageSize=5');
    const baby = list.body.items[0] as { id: string; name: string };
    await page.goto(`${base}/infants/${baby.id}`);
    await page.getByRole('heading', { level: 1, name: baby.name }).waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download as FHIR' }).click()]);
    expect(download.suggestedFilename()).toBe(`nestflow-${baby.id}.fhir.json`);
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'nestflow-fhir-')), download.suggestedFilename());
    await download.saveAs(file);
    const bundle = JSON.parse(readFileSync(file, 'utf8')) as fhir4.Bundle<fhir4.FhirResource>;
    expect(fhirProblems(bundle)).toEqual([]);
    const patient = bundle.entry?.map((e) => e.resource).find((r) => r?.resourceType === 'Patient') as fhir4.Patient;
    expect(patient.identifier?.[0].value).toBe(baby.id);
  });
});
