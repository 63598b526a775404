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

/** Signs out through the API with the context's cookies, if anyone is signed in. */
async function endSessionOnServer(context: BrowserContext, base: string): Promise<void> {
  const session = await context.request.get(`${base}/api/session`);
  const body = (await session.json()) as { user: unknown; csrfToken: string };
  if (!body.user) return;
  const res = await context.request.delete(`${base}/api/session`, { headers: { 'x-csrf-token': body.csrfToken } });
  if (res.status() !== 204) throw new Error(`sign-out answered ${res.status()}`);
}

/**
 * Leaves the app, ends the current session on the server, then drops the cookies. Ending it on the server matters:
 * a poll still in flight can set the rolling session cookie again after it was cleared, and the next page would
 * then see the previous person signed in; a cookie of an ended session signs no one in.
 */
export async function signOut(browser: Browser, base: string): Promise<void> {
  await browser.page.goto('about:blank');
  await endSessionOnServer(browser.context, base);
  await browser.context.clearCookies();
}

/** Signs in through the form from a signed-out start, whatever the previous case left behind. */
export async function signIn(browser: Browser, base: string, email: string, password = 'nestflow-demo'): Promise<void> {
  const { page } = browser;
  await signOut(browser, base);
  await page.goto(`${base}/sign-in`);
  if (!new URL(page.url()).pathname.startsWith('/sign-in')) {
    throw new Error(`the sign-in page moved on to ${page.url()} although the previous session was ended`);
  }
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
