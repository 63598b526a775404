import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, mkdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

export const SCREENSHOT_DIR = path.resolve('artifacts/screenshots');

const ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

export interface Browser {
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

/** Debian's Chromium through playwright-core, a fresh profile each time. */
export async function openBrowser(viewport = { width: 1280, height: 860 }): Promise<Browser> {
  const dir = mkdtempSync(path.join(tmpdir(), 'nestflow-chromium-'));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: ARGS,
    viewport,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the form from a signed-out start, whatever the previous case left behind. */
export async function signIn(browser: Browser, base: string, email: string, password = 'nestflow-demo'): Promise<void> {
  const { page } = browser;
  // Leave the app first: a request still in flight could otherwise set the previous person's rolling session
  // cookie again after it was cleared, and the sign-in page would then redirect to their home.
  await page.goto('about:blank');
  await browser.context.clearCookies();
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in and waits until the app has moved on from the sign-in page. */
export async function signInAndLand(browser: Browser, base: string, email: string, password?: string): Promise<void> {
  await signIn(browser, base, email, password);
  await browser.page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

export interface PageApiResult {
  status: number;
  body: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- JSON of whichever route was called
}

/** A same-origin API call from the signed-in page, carrying the session's CSRF token like the app does. */
export function pageApi(page: Page) {
  return (method: string, path: string, body?: unknown): Promise<PageApiResult> =>
    page.evaluate(
      async ({ method, path, body }) => {
        const { csrfToken } = await (await fetch('/api/session')).json();
        const res = await fetch(path, {
          method,
          headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken },
          body: body ? JSON.stringify(body) : undefined,
        });
        return { status: res.status, body: await res.json().catch(() => null) };
      },
      { method, path, body },
    );
}
