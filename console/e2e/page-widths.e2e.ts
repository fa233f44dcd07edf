import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  baseUrl,
  demoSignIn,
  finishTest,
  openBrowser,
  pageWidths,
  screenshot,
  signIn,
  type Session,
} from './browser';

// The owner's list pages at a phone's, a tablet's (the rail beside the content) and a desktop's
// width: nothing sticks out sideways, every control is in view without scrolling a box sideways,
// no table has to be scrolled sideways to be read, no button or action link breaks onto a second
// line, and nothing spills out of its card.

const owner = demoSignIn('owner');
const WIDTHS = [375, 768, 1280] as const;
const PAGES = [
  ['/setups', 'Setups'],
  ['/gear', 'Gear'],
  ['/keys', 'Keys'],
  ['/usage', 'Usage'],
  ['/billing', 'Billing'],
  ['/audit', 'Audit'],
] as const;

let session: Session;
let page: Page;

beforeAll(async () => {
  session = await openBrowser();
  page = session.page;
  await signIn(page, owner);
});

afterAll(async () => {
  await session?.close();
});

afterEach(async (context) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await finishTest(session, `widths-${context.task.name}`);
});

/** What does not fit in <main>, measured in the browser (each entry names the element). */
function layoutFaults(target: Page) {
  return target.evaluate(() => {
    const name = (el: Element) =>
      `${el.tagName.toLowerCase()} "${(el.textContent ?? '').trim().slice(0, 30)}"`;
    const shown = (el: Element) => {
      const box = el.getBoundingClientRect();
      return box.width > 1 && box.height > 1 && getComputedStyle(el).visibility !== 'hidden';
    };
    const scrollBox = (el: Element) => {
      for (let p = el.parentElement; p; p = p.parentElement) {
        const overflow = getComputedStyle(p).overflowX;
        if (overflow === 'auto' || overflow === 'scroll') return p;
      }
      return null;
    };
    const main = document.querySelector('main')!;
    const controls = [
      ...main.querySelectorAll('button, select, input, a[download], a.rounded-control'),
    ].filter(shown);
    const width = document.documentElement.clientWidth;
    // A control past the window's edge, or past the edge of the box it scrolls in.
    const outOfView = controls
      .filter((el) => {
        const box = el.getBoundingClientRect();
        const scroller = scrollBox(el)?.getBoundingClientRect();
        const right = Math.min(width, scroller?.right ?? width);
        const left = Math.max(0, scroller?.left ?? 0);
        return box.right > right + 1 || box.left < left - 1;
      })
      .map(name);
    // A label on two lines: the text's line boxes start at more than one height.
    const wrapped = controls
      .filter((el) => el.matches('button, a'))
      .filter((el) => {
        const range = document.createRange();
        range.selectNodeContents(el);
        const tops = new Set([...range.getClientRects()].map((r) => Math.round(r.top)));
        return tops.size > 1;
      })
      .map(name);
    // Anything wider than the card it sits in (a price, a long word).
    const spilled = [...main.querySelectorAll('article *')]
      .filter(shown)
      .filter((el) => {
        const card = el.closest('article')!.getBoundingClientRect();
        const box = el.getBoundingClientRect();
        return box.right > card.right + 1 || box.left < card.left - 1;
      })
      .map(name);
    // A table wider than its box (read only by scrolling it sideways), named by its caption.
    const tables = [...main.querySelectorAll('table')].filter(shown);
    const sideways = tables
      .filter((table) => {
        const box = table.parentElement!;
        return box.scrollWidth > box.clientWidth + 1 || table.scrollWidth > box.clientWidth + 1;
      })
      .map((table) => table.querySelector('caption')?.textContent ?? name(table));
    return {
      outOfView,
      wrapped,
      spilled,
      sideways,
      controls: controls.length,
      tables: tables.length,
    };
  });
}

describe('list pages at phone, tablet and desktop widths', () => {
  for (const width of WIDTHS) {
    it(`fit at ${width} px`, async () => {
      await page.setViewportSize({ width, height: 900 });
      for (const [route, heading] of PAGES) {
        await page.goto(`${baseUrl}${route}`);
        await page.getByRole('heading', { level: 1, name: heading }).waitFor();
        await page.waitForLoadState('networkidle');
        const { scrollWidth, innerWidth } = await pageWidths(page);
        expect({ route, scrollWidth }).toEqual({ route, scrollWidth: innerWidth });
        const faults = await layoutFaults(page);
        // The page has controls to check (the checks below are not vacuous).
        expect(faults.controls, route).toBeGreaterThan(0);
        // Every page here lists something in a table (the demo studio has rows on each).
        expect(faults.tables, route).toBeGreaterThan(0);
        expect({ route, ...faults, controls: undefined, tables: undefined }).toEqual({
          route,
          outOfView: [],
          wrapped: [],
          spilled: [],
          sideways: [],
          controls: undefined,
          tables: undefined,
        });
        await screenshot(page, `widths${route.replace('/', '-')}-${width}`);
      }
    });
  }
});
