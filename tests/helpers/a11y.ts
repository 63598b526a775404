import type { Page } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

export interface AxeViolation { id: string; impact: string | null; targets: string[] }

/** Every axe finding on the page as it is now (WCAG 2.x A and AA rules and axe's best practices). */
export async function axeViolations(page: Page): Promise<AxeViolation[]> {
  await page.evaluate(axeSource);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: () => Promise<{ violations: Array<{ id: string; impact: string | null; nodes: Array<{ target: unknown[] }> }> }> } }).axe;
    const result = await axe.run();
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, targets: v.nodes.map((n) => n.target.map(String).join(' ')) }));
  });
}

export const isSerious = (v: AxeViolation) => v.impact === 'serious' || v.impact === 'critical';

export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  return (await axeViolations(page)).filter(isSerious);
}

export const axeReport = (violations: AxeViolation[]) =>
  violations.map((v) => `${v.id} (${v.impact}): ${v.targets.join(', ')}`).join('\n');

/** What has focus: its tag, name and box, and whether it is the page's h1 or an error summary. */
export async function focused(page: Page) {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const box = el.getBoundingClientRect();
    return {
      tag: el.tagName.toLowerCase(),
      text: (el.getAttribute('aria-label') ?? el.textContent ?? '').replace(/\s+/g, ' ').trim().slice(0, 80),
      isPageHeading: el.tagName === 'H1',
      isErrorSummary: el.hasAttribute('data-error-summary'),
      box: { top: box.top, bottom: box.bottom, left: box.left, right: box.right },
    };
  });
}

export interface CoveredStop { stop: number; text: string; focus: { top: number; bottom: number }; menuTop: number }

/**
 * Tabs through the page from the top and, at every stop, compares the focused element's box with the bottom menu's
 * (fixed below 1024 px). Returns the stops the menu covers (WCAG 2.4.11) and how many stops there were.
 */
export async function tabThroughPage(page: Page, maxStops = 120): Promise<{ stops: number; covered: CoveredStop[] }> {
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    window.scrollTo(0, 0);
  });
  const covered: CoveredStop[] = [];
  let first = '';
  let stops = 0;
  for (; stops < maxStops; stops += 1) {
    await page.keyboard.press('Tab');
    const state = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el || el === document.body) return null;
      const menu = document.querySelector('nav[aria-label="Main"]') as HTMLElement | null;
      const fixed = menu && getComputedStyle(menu).position === 'fixed' ? menu.getBoundingClientRect() : null;
      const box = el.getBoundingClientRect();
      const key = `${el.tagName}#${el.id}|${el.textContent?.slice(0, 40)}|${Math.round(box.top + window.scrollY)}`;
      return {
        key,
        inMenu: Boolean(menu?.contains(el)),
        text: (el.getAttribute('aria-label') ?? el.textContent ?? el.tagName).replace(/\s+/g, ' ').trim().slice(0, 60),
        top: box.top,
        bottom: box.bottom,
        menuTop: fixed ? fixed.top : null,
      };
    });
    if (!state) break;
    if (stops === 0) first = state.key;
    else if (state.key === first) break;
    // A control that fits above the menu must be wholly above it; a taller one (a scroll region round a long table)
    // must at least start above it, so part of it and its ring show (WCAG 2.4.11 asks for "not entirely hidden").
    const fitsAbove = state.menuTop !== null && state.bottom - state.top <= state.menuTop;
    const hidden = state.menuTop !== null && (fitsAbove ? state.bottom > state.menuTop + 0.5 : state.top >= state.menuTop);
    if (!state.inMenu && hidden) {
      covered.push({ stop: stops + 1, text: state.text, focus: { top: state.top, bottom: state.bottom }, menuTop: state.menuTop ?? 0 });
    }
  }
  return { stops, covered };
}

/** Heading levels in page order, and any place where one skips a level going down (h2 → h4). */
export async function headingSkips(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const headings = [...document.querySelectorAll<HTMLElement>('h1, h2, h3, h4, h5, h6')].filter((h) => h.offsetParent !== null || h.getClientRects().length > 0);
    const skips: string[] = [];
    let previous = 0;
    for (const h of headings) {
      const level = Number(h.tagName[1]);
      if (previous && level > previous + 1) skips.push(`h${previous} → h${level} "${h.textContent?.trim().slice(0, 40)}"`);
      previous = level;
    }
    return skips;
  });
}

/**
 * Whether the focused element's ring is cut off: its box grown by the outline (width + offset, when drawn outside)
 * must lie inside every ancestor that clips (overflow other than visible). Returns the clipping ancestors.
 */
export async function ringClippedBy(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return ['nothing focused'];
    const style = getComputedStyle(el);
    if (style.outlineStyle === 'none' || parseFloat(style.outlineWidth) === 0) return ['no focus ring'];
    const grow = Math.max(0, parseFloat(style.outlineWidth) + parseFloat(style.outlineOffset));
    const box = el.getBoundingClientRect();
    const ring = { top: box.top - grow, bottom: box.bottom + grow, left: box.left - grow, right: box.right + grow };
    const clips: string[] = [];
    for (let node = el.parentElement; node && node !== document.body; node = node.parentElement) {
      const s = getComputedStyle(node);
      if (s.overflowX === 'visible' && s.overflowY === 'visible') continue;
      const r = node.getBoundingClientRect();
      if (ring.top < r.top - 0.5 || ring.bottom > r.bottom + 0.5 || ring.left < r.left - 0.5 || ring.right > r.right + 0.5) {
        clips.push(`${node.tagName.toLowerCase()}.${node.className.toString().split(' ').slice(0, 3).join('.')}`);
      }
    }
    return clips;
  });
}

const LIVE = '[aria-live], [role="status"], [role="alert"], [role="log"], [role="marquee"], [role="timer"]';

/** Live regions inside another live region: screen readers read them twice or not at all. */
export async function nestedLiveRegions(page: Page): Promise<string[]> {
  return page.evaluate((live) =>
    [...document.querySelectorAll<HTMLElement>(live)]
      .filter((el) => el.parentElement?.closest(live))
      .map((el) => `${el.tagName.toLowerCase()}[${el.getAttribute('role') ?? `aria-live=${el.getAttribute('aria-live')}`}] ${el.textContent?.trim().slice(0, 40)}`), LIVE);
}
