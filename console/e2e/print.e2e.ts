import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  artifactPath,
  baseUrl,
  demoSignIn,
  finishTest,
  openBrowser,
  screenshot,
  signIn,
  type Session,
} from './browser';

// What people print from the console: the Setups list and a saved setup reopened in the playground
// (its Dusk setup result). In print media the navigation, buttons, tab list and dialogs are gone,
// the page is black on white (in the night theme too) and tables fit the paper.

const photographer = demoSignIn('photographer');
/** About an A4 sheet's printable width in CSS pixels (210 mm at 96 px per inch, less margins). */
const PAPER = { width: 720, height: 1000 };

let session: Session;
let page: Page;

beforeAll(async () => {
  session = await openBrowser();
  page = session.page;
  await signIn(page, photographer);
});

afterAll(async () => {
  await session?.close();
});

afterEach(async (context) => {
  await page.emulateMedia({ media: 'screen' });
  await page.setViewportSize({ width: 1280, height: 900 });
  await finishTest(session, `print-${context.task.name}`);
});

/** What print media leaves on the page, measured in the browser. */
function printedPage(target: Page) {
  return target.evaluate(() => {
    const shown = (el: Element) => {
      const box = el.getBoundingClientRect();
      return getComputedStyle(el).display !== 'none' && box.width > 0 && box.height > 0;
    };
    const main = document.querySelector('main')!;
    return {
      navigation: [...document.querySelectorAll('nav, [role="navigation"]')].filter(shown).length,
      // The shell's rail (brand, menu, user menu); the cautions are an <aside> too, and print.
      rails: [...document.querySelectorAll('aside:has(nav)')].filter(shown).length,
      cautions: [...document.querySelectorAll('[aria-label="Safety cautions"]')].filter(shown)
        .length,
      buttons: [...document.querySelectorAll('button')].filter(shown).length,
      tablists: [...document.querySelectorAll('[role="tablist"]')].filter(shown).length,
      searches: [...document.querySelectorAll('[role="search"]')].filter(shown).length,
      // A dialog's own box can be empty (its panel is fixed-position): any part of it showing counts.
      dialogs: [...document.querySelectorAll('[role="dialog"]')].filter(
        (d) => shown(d) || [...d.querySelectorAll('*')].some(shown),
      ).length,
      mainShown: shown(main),
      background: getComputedStyle(document.body).backgroundColor,
      ink: getComputedStyle(main).color,
      // A table cut off shows as more width than its box (or the page) has room for.
      tablesCut: [...document.querySelectorAll('table')]
        .filter(shown)
        .filter(
          (t) =>
            t.scrollWidth > (t.parentElement?.clientWidth ?? 0) + 1 ||
            t.getBoundingClientRect().right > document.documentElement.clientWidth + 1,
        ).length,
      tables: [...document.querySelectorAll('table')].filter(shown).length,
      pageScrollsSideways:
        document.documentElement.scrollWidth > document.documentElement.clientWidth + 1,
    };
  });
}

/** Print media leaves no navigation, rail, buttons, search box, tab list or dialog; the content stays. */
const withoutControls = {
  navigation: 0,
  rails: 0,
  buttons: 0,
  tablists: 0,
  searches: 0,
  dialogs: 0,
  mainShown: true,
};

const black = 'rgb(0, 0, 0)';
const white = 'rgb(255, 255, 255)';

/**
 * Print media at the window's desktop width (where the screen shows the navigation rail), then at
 * a sheet's width, where the page is laid out for paper: no controls either way, and on paper black
 * ink on white with no table cut and no sideways scroll. Returns what the paper width left.
 */
async function printAtBothWidths(target: Page) {
  await target.emulateMedia({ media: 'print' });
  await expect(printedPage(target)).resolves.toMatchObject(withoutControls);
  await target.setViewportSize(PAPER);
  const printed = await printedPage(target);
  expect(printed).toMatchObject({
    ...withoutControls,
    background: white,
    ink: black,
    tablesCut: 0,
    pageScrollsSideways: false,
  });
  return printed;
}

describe('printing from the console', () => {
  it('prints the Setups list without navigation or buttons, its table whole', async () => {
    await page.goto(`${baseUrl}/setups`);
    await page.getByRole('heading', { level: 1, name: 'Setups' }).waitFor();
    await page.getByRole('table').waitFor();
    // On screen the navigation and buttons are there (the check below is not vacuous).
    const onScreen = await printedPage(page);
    expect(onScreen.navigation).toBeGreaterThan(0);
    expect(onScreen.buttons).toBeGreaterThan(0);
    expect(onScreen.searches).toBe(1);

    const printed = await printAtBothWidths(page);
    expect(printed.tables).toBe(1);
    await screenshot(page, 'print-setups');
  });

  it('prints a reopened saved setup: the Dusk setup result, black on white even at night', async () => {
    await page.goto(`${baseUrl}/setups`);
    const open = page.getByRole('link', { name: /^Open .* in the playground$/ }).first();
    await open.click();
    await page.waitForURL(/\/playground\?setup=[0-9a-f-]+&calc=setup/);
    const panel = page.locator('[role="tabpanel"]:visible');
    await panel.getByTestId('setup-plan').waitFor();
    // The night theme on screen: paper still gets black ink on white.
    await page.getByRole('switch', { name: 'Night theme' }).click();
    await expect
      .poll(() => page.evaluate(() => document.documentElement.dataset.theme))
      .toBe('night');
    const onScreen = await printedPage(page);
    expect(onScreen.tablists).toBe(1);
    expect(onScreen.navigation).toBeGreaterThan(0);
    expect(onScreen.ink).not.toBe(black);
    const swatchFilters = () =>
      page.evaluate(() =>
        [...document.querySelectorAll('[data-swatch] > div[aria-hidden="true"]')].map(
          (el) => getComputedStyle(el).filter,
        ),
      );
    // On a night screen the swatches are dimmed.
    expect(await swatchFilters()).toContain('brightness(0.45)');

    // The print button is on the screen and opens the print dialog (stood in for here: a headless
    // browser has none to show).
    const printButton = panel.getByRole('button', { name: 'Print this plan' });
    await expect(printButton.isVisible()).resolves.toBe(true);
    await page.evaluate(() => {
      const w = window as typeof window & { printCalls?: number };
      w.printCalls = 0;
      w.print = () => {
        w.printCalls = (w.printCalls ?? 0) + 1;
      };
    });
    await printButton.click();
    await expect(
      page.evaluate(() => (window as typeof window & { printCalls?: number }).printCalls),
    ).resolves.toBe(1);

    const printed = await printAtBothWidths(page);
    // ...and not on the paper it prints.
    await expect(printButton.isVisible()).resolves.toBe(false);
    // Swatches keep their colour on paper: not dimmed as on a night screen.
    const printedFilters = await swatchFilters();
    expect(printedFilters.length).toBeGreaterThan(0);
    for (const filter of printedFilters) expect(filter).not.toContain('0.45');
    // The suggested minutes are a table, and the plan and its cautions are on the paper.
    expect(printed.tables).toBeGreaterThan(0);
    expect(printed.cautions).toBe(1);
    await expect(panel.getByTestId('setup-plan').isVisible()).resolves.toBe(true);
    await screenshot(page, 'print-reopened-setup');
    const pdf = await page.pdf({ path: artifactPath('print-reopened-setup.pdf'), format: 'A4' });
    expect(pdf.byteLength).toBeGreaterThan(10_000);

    // Printed while a dialog is open: the dialog stays off the paper, the page is there.
    await page.emulateMedia({ media: 'screen' });
    await panel.getByRole('button', { name: 'Save setup' }).click();
    await page.getByRole('dialog').getByLabel('Name').waitFor();
    await expect(printedPage(page)).resolves.toMatchObject({ dialogs: 1 });
    await page.emulateMedia({ media: 'print' });
    await expect(printedPage(page)).resolves.toMatchObject(withoutControls);
    await page.keyboard.press('Escape');
  });
});
