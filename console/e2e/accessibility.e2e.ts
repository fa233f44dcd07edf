import fs from 'node:fs';
import { createRequire } from 'node:module';
import type { AxeResults } from 'axe-core';
import type { Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import {
  PHONE,
  baseUrl,
  demoSignIn,
  finishTest,
  openBrowser,
  playgroundTabs,
  signIn,
  type Session,
} from './browser';

// axe-core's own build, injected into each page as a script (the console's CSP allows inline
// scripts; axe reads the DOM only).
const axeSource = fs.readFileSync(
  createRequire(import.meta.url).resolve('axe-core/axe.min.js'),
  'utf8',
);

/** WCAG 2.0 and 2.1, levels A and AA, as axe-core tags its rules. */
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

interface Finding {
  page: string;
  rule: string;
  impact: string;
  target: string;
  help: string;
}

let session: Session;
let page: Page;
const owner = demoSignIn('owner');

beforeAll(async () => {
  session = await openBrowser();
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

let expectedErrors: string[] = [];
afterEach(async (context) => {
  const expected = expectedErrors;
  expectedErrors = [];
  await finishTest(session, context.task.name, expected);
});

/** Runs axe on what is on screen now; returns its violations, one line per element. */
async function audit(where: string): Promise<Finding[]> {
  const loaded = await page.evaluate(() => 'axe' in window);
  if (!loaded) await page.addScriptTag({ content: axeSource });
  const results = (await page.evaluate(
    (tags) =>
      (
        window as unknown as { axe: { run: (ctx: unknown, o: unknown) => Promise<unknown> } }
      ).axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] }),
    WCAG_TAGS,
  )) as AxeResults;
  // A run that checked nothing would pass anything: make sure rules ran on this page.
  expect(results.passes.length + results.violations.length, `axe ran on ${where}`).toBeGreaterThan(
    0,
  );
  return results.violations.flatMap((violation) =>
    violation.nodes.map((node) => ({
      page: where,
      rule: violation.id,
      impact: violation.impact ?? 'unknown',
      target: node.target.map(String).join(' '),
      help: node.failureSummary?.split('\n').slice(0, 2).join(' ') ?? violation.help,
    })),
  );
}

/** Waits until the page has its heading and nothing is still loading. */
async function settle(heading: string | RegExp) {
  await page.getByRole('heading', { level: 1, name: heading }).waitFor();
  await page.waitForLoadState('networkidle');
  await page
    .getByRole('status')
    .filter({ hasText: /^Loading/ })
    .first()
    .waitFor({ state: 'detached', timeout: 10_000 })
    .catch(() => undefined);
}

function readable(findings: Finding[]): string {
  return findings
    .map((f) => `${f.rule} [${f.impact}] ${f.target}  (${f.page}) ${f.help}`)
    .join('\n');
}

function tally(findings: Finding[]): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const f of findings) counts[f.rule] = (counts[f.rule] ?? 0) + 1;
  return counts;
}

/** The signed-in pages, each with its h1 (the profile is the Account page). */
const PAGES: [path: string, heading: string][] = [
  ['/', 'Overview'],
  ['/setups', 'Setups'],
  ['/frames', 'Test frames'],
  ['/gear', 'Gear'],
  ['/team', 'Team'],
  ['/usage', 'Usage'],
  ['/billing', 'Billing'],
  ['/audit', 'Audit'],
  ['/account', 'Account'],
];

type Theme = 'day' | 'night';

/**
 * Stores a theme and applies it to the page on screen, as the console does at its next load
 * (`lib/theme.ts` reads the stored choice and sets `<html data-theme>`); no reload needed.
 */
async function switchTheme(theme: Theme) {
  await page.evaluate((t) => {
    window.localStorage.setItem('lumenwright.theme', t);
    document.documentElement.dataset.theme = t;
  }, theme);
  await coloursSettled();
}

/** Buttons and links fade between colours: axe must see the end colours, not a mix. */
async function coloursSettled() {
  await page.waitForFunction(() =>
    document
      .getAnimations()
      .every((a) => !(a instanceof CSSTransition) || a.playState === 'finished'),
  );
}

/**
 * Runs axe on every screen. With two themes, each screen is checked in both before moving on
 * (one page load for both): the phone pass does this to keep its time small.
 */
async function auditConsole(themes: Theme[], size = 'desktop'): Promise<Finding[]> {
  const findings: Finding[] = [];
  const visited: string[] = [];
  const first = themes[0]!;
  const check = async (where: string) => {
    visited.push(where);
    for (const theme of themes) {
      if (theme !== first) await switchTheme(theme);
      findings.push(...(await audit(`${where} (${theme}, ${size})`)));
    }
    if (themes.length > 1) await switchTheme(first);
  };

  // Signed out: the theme is a stored preference, so it applies here too.
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/sign-in`);
  await page.evaluate((t) => window.localStorage.setItem('lumenwright.theme', t), first);
  await page.reload();
  await settle('Sign in');
  await expect(page.evaluate(() => document.documentElement.dataset.theme)).resolves.toBe(first);
  await check('sign-in');
  await page.goto(`${baseUrl}/sign-up`);
  await settle('Create a studio account');
  await check('sign-up');

  await signIn(page, owner);
  for (const [path, heading] of PAGES) {
    await page.goto(`${baseUrl}${path}`);
    await settle(heading);
    await check(path);
  }

  await page.goto(`${baseUrl}/keys`);
  await settle('Keys');
  await check('/keys');
  await page.getByRole('button', { name: 'Create key' }).click();
  // Headless UI's dialog element has no box of its own; its panel and fields do.
  await page.getByRole('dialog').getByLabel('Name').waitFor();
  await check('/keys new-key dialog');
  await page.keyboard.press('Escape');
  await page.getByRole('dialog').waitFor({ state: 'detached' });

  await page.goto(`${baseUrl}/playground`);
  await settle('Playground');
  const tabs = page.getByRole('tablist', { name: 'Calculations' }).getByRole('tab');
  const count = await tabs.count();
  expect(count).toBe(8);
  for (let index = 0; index < count; index++) {
    const tab = tabs.nth(index);
    const label = (await tab.textContent()) ?? `tab ${index}`;
    await tab.click();
    const panel = page.locator('[role="tabpanel"]:visible');
    // A computed result: its chart or diagram, and the API's answer compared.
    await panel.locator('[role="img"]').first().waitFor();
    const confirmation = panel.locator('[data-confirmation]').first();
    await confirmation.waitFor();
    await page.waitForFunction(
      (el) => el?.getAttribute('data-confirmation') !== 'waiting',
      await confirmation.elementHandle(),
    );
    await check(`/playground ${label}`);
  }

  // Sign-in, sign-up, nine pages, keys and its dialog, eight tabs.
  const screens = 21;
  if (size === 'phone') {
    // The navigation folded behind "Menu" exists only on a phone: open it and check it too,
    // switching the theme with its own switch.
    await page.goto(`${baseUrl}/`);
    await settle('Overview');
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('link', { name: 'Usage', exact: true }).waitFor();
    visited.push('menu');
    const toggle = page.getByRole('switch', { name: 'Night theme' });
    for (const theme of themes) {
      if ((await toggle.getAttribute('aria-checked')) !== String(theme === 'night'))
        await toggle.click();
      await expect(page.evaluate(() => document.documentElement.dataset.theme)).resolves.toBe(
        theme,
      );
      await coloursSettled();
      findings.push(...(await audit(`menu (${theme}, ${size})`)));
    }
    await switchTheme(first);
  }
  expect(visited).toHaveLength(size === 'phone' ? screens + 1 : screens);
  return findings;
}

describe('accessibility (axe-core, WCAG 2.1 A and AA)', () => {
  for (const theme of ['day', 'night'] as const) {
    it(`every console page in the ${theme} theme`, async () => {
      // Signed out on purpose: the session check answers 401 before the sign-in page shows.
      expectedErrors = [`http 401: GET ${baseUrl}/v1/me`];
      const findings = await auditConsole([theme]);
      if (findings.length > 0) {
        console.error(
          `axe: ${findings.length} violations in the ${theme} theme\n` +
            `${JSON.stringify(tally(findings))}\n${readable(findings)}`,
        );
      }
      expect(readable(findings)).toBe('');
    });
  }
});

describe('accessibility on a phone (axe-core, WCAG 2.1 A and AA)', () => {
  it(`every console page and the menu at ${PHONE.width} px, day and night`, async () => {
    expectedErrors = [`http 401: GET ${baseUrl}/v1/me`];
    await page.setViewportSize(PHONE);
    try {
      const findings = await auditConsole(['day', 'night'], 'phone');
      if (findings.length > 0) {
        console.error(
          `axe: ${findings.length} violations at ${PHONE.width} px\n` +
            `${JSON.stringify(tally(findings))}\n${readable(findings)}`,
        );
      }
      expect(readable(findings)).toBe('');
    } finally {
      await page.setViewportSize({ width: 1280, height: 900 });
    }
  });
});

/** The focused element: whether it is the marked target, and whether its focus can be seen. */
async function focusState() {
  return page.evaluate(() => {
    const el = document.activeElement;
    if (!el || el === document.body) return { hit: false, visible: true, what: 'body' };
    const drawn = (node: Element) => {
      const style = getComputedStyle(node);
      const outline = style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0;
      return outline || style.boxShadow !== 'none';
    };
    const box = el.getBoundingClientRect();
    // An element with no box of its own (a visually hidden file input) shows focus on its label.
    const visible =
      (box.width >= 4 && box.height >= 4 && drawn(el)) ||
      (el.closest('label') !== null && drawn(el.closest('label')!));
    const name = el.getAttribute('aria-label') ?? el.textContent?.trim().slice(0, 40) ?? '';
    return {
      hit: el.hasAttribute('data-a11y-target'),
      visible,
      what: `${el.tagName.toLowerCase()} "${name}"`,
    };
  });
}

/**
 * Tabs from the top of a freshly loaded page until `target` has focus; every stop on the way must
 * show its focus (WCAG 2.1 SC 2.1.1 and 2.4.7). Returns the presses it took and the stops whose
 * focus could not be seen.
 */
async function tabTo(target: Locator, limit = 80) {
  await target.evaluate((el) => el.setAttribute('data-a11y-target', ''));
  const unseen: string[] = [];
  for (let presses = 1; presses <= limit; presses++) {
    await page.keyboard.press('Tab');
    const state = await focusState();
    if (!state.visible) unseen.push(state.what);
    if (state.hit) return { presses, unseen };
  }
  return { presses: Infinity, unseen };
}

/** Each page's main action (what a person comes to the page to do). */
const MAIN_ACTIONS: [path: string, heading: string, action: (p: Page) => Locator][] = [
  ['/', 'Overview', (p) => p.getByRole('link', { name: 'Try the numbers' })],
  ['/keys', 'Keys', (p) => p.getByRole('button', { name: 'Create key' })],
  ['/usage', 'Usage', (p) => p.getByRole('link', { name: 'Export CSV' })],
  [
    '/playground',
    'Playground',
    (p) => p.locator('[role="tabpanel"]:visible').getByRole('button', { name: 'Copy as curl' }),
  ],
  ['/setups', 'Setups', (p) => p.getByRole('button', { name: 'Save a setup' })],
  ['/frames', 'Test frames', (p) => p.getByLabel(/choose a file/)],
  ['/gear', 'Gear', (p) => p.getByRole('button', { name: 'Add light' })],
  ['/team', 'Team', (p) => p.getByRole('button', { name: 'Send invitation' })],
  ['/audit', 'Audit', (p) => p.getByRole('textbox', { name: 'Action' })],
  ['/billing', 'Billing', (p) => p.getByRole('button', { name: / to / }).first()],
  ['/account', 'Account', (p) => p.getByRole('button', { name: 'Change password' })],
];

/** Dialogs and the buttons that open them (opened and closed with Escape; nothing is changed). */
const DIALOGS: [path: string, heading: string, opener: (p: Page) => Locator][] = [
  ['/keys', 'Keys', (p) => p.getByRole('button', { name: 'Create key' })],
  ['/keys', 'Keys', (p) => p.getByRole('button', { name: /^Rotate / }).first()],
  ['/keys', 'Keys', (p) => p.getByRole('button', { name: /^Revoke / }).first()],
  ['/setups', 'Setups', (p) => p.getByRole('button', { name: 'Save a setup' })],
  ['/setups', 'Setups', (p) => p.getByRole('button', { name: /^Delete / }).first()],
  ['/gear', 'Gear', (p) => p.getByRole('button', { name: 'Add light' })],
  ['/gear', 'Gear', (p) => p.getByRole('button', { name: 'Add modifier' })],
  ['/gear', 'Gear', (p) => p.getByRole('button', { name: /^Add gel to / }).first()],
  ['/frames', 'Test frames', (p) => p.getByRole('button', { name: /^Delete / }).first()],
  ['/team', 'Team', (p) => p.getByRole('button', { name: /^Remove / }).first()],
  ['/account', 'Account', (p) => p.getByRole('button', { name: 'Sign out everywhere' })],
  ['/studio', 'Studio settings', (p) => p.getByRole('button', { name: 'Delete studio' })],
  [
    '/playground?calc=setup',
    'Playground',
    (p) => p.locator('[role="tabpanel"]:visible').getByRole('button', { name: 'Save setup' }),
  ],
];

/** Where focus is now, relative to the open dialog. */
function focusInDialog() {
  return page.evaluate(() => {
    const el = document.activeElement;
    const panel = el?.closest('[role="dialog"]');
    return !!panel && !el?.hasAttribute('data-headlessui-focus-guard');
  });
}

describe('keyboard', () => {
  it('reaches every page’s main action with Tab, focus visible at each stop', async () => {
    await page.context().clearCookies();
    await page.goto(`${baseUrl}/sign-in`);
    await page.evaluate(() => window.localStorage.setItem('lumenwright.theme', 'day'));
    expectedErrors = [`http 401: GET ${baseUrl}/v1/me`];
    const report: string[] = [];
    const walk = async (where: string, target: Locator) => {
      const { presses, unseen } = await tabTo(target);
      if (!Number.isFinite(presses)) report.push(`${where}: main action not reached in 80 Tabs`);
      for (const stop of unseen) report.push(`${where}: focus not visible on ${stop}`);
      return presses;
    };
    await page.goto(`${baseUrl}/sign-in`);
    await settle('Sign in');
    const counts: Record<string, number> = {};
    counts['/sign-in'] = await walk('/sign-in', page.getByRole('button', { name: 'Sign in' }));
    await page.goto(`${baseUrl}/sign-up`);
    await settle('Create a studio account');
    counts['/sign-up'] = await walk(
      '/sign-up',
      page.getByRole('button', { name: 'Create account' }),
    );
    await signIn(page, owner);
    for (const [path, heading, action] of MAIN_ACTIONS) {
      await page.goto(`${baseUrl}${path}`);
      await page.getByRole('heading', { level: 1, name: heading }).waitFor();
      await action(page).waitFor();
      counts[path] = await walk(path, action(page));
    }
    console.log(`Tab presses to each main action: ${JSON.stringify(counts)}`);
    expect(report).toEqual([]);
  });

  it('keeps focus inside every dialog and gives it back to the opener on close', async () => {
    const report: string[] = [];
    let checked = 0;
    for (const [index, [path, heading, opener]] of DIALOGS.entries()) {
      // Each page is loaded once for all its dialogs (nothing is changed in between).
      if (DIALOGS[index - 1]?.[0] !== path) {
        await page.goto(`${baseUrl}${path}`);
        await page.getByRole('heading', { level: 1, name: heading }).waitFor();
      }
      const button = opener(page);
      const where = `${path} ${(await button.textContent())?.trim()}`;
      await button.focus();
      // The check below can tell: on the page, focus is not in a dialog.
      if (await focusInDialog()) report.push(`${where}: a dialog was open before the opener`);
      await page.keyboard.press('Enter');
      const dialog = page.getByRole('dialog');
      await dialog.getByRole('heading').first().waitFor();
      if (!(await focusInDialog())) report.push(`${where}: focus did not move into the dialog`);
      // More presses than the dialog has stops, both ways: focus must wrap, never leave.
      const stops = await dialog.locator('a,button,input,select,textarea,[tabindex]').count();
      for (const key of ['Tab', 'Shift+Tab']) {
        for (let i = 0; i < stops + 2; i++) {
          await page.keyboard.press(key);
          if (!(await focusInDialog())) {
            report.push(`${where}: ${key} ${i + 1} left the dialog`);
            break;
          }
        }
      }
      await page.keyboard.press('Escape');
      await dialog.waitFor({ state: 'detached' });
      const back = await button.evaluate((el) => el === document.activeElement);
      if (!back) report.push(`${where}: focus not returned to the opener`);
      checked++;
    }
    expect(checked).toBe(DIALOGS.length);
    expect(report).toEqual([]);
  });

  it('goes from each playground tab straight to a field of its panel with Tab', async () => {
    const { tabs, count } = await playgroundTabs(page);
    const landed: string[] = [];
    for (let index = 0; index < count; index++) {
      const tab = tabs.nth(index);
      await tab.click();
      await tab.focus();
      await page.keyboard.press('Tab');
      // WAI-ARIA tabs pattern: Tab leaves the tab list for the panel; a panel that holds
      // controls gives focus to its first control rather than taking it itself.
      landed.push(
        await page.evaluate(() => {
          const el = document.activeElement;
          const panel = el?.closest('[role="tabpanel"]');
          if (!el || !panel) return `outside a panel: ${el?.tagName.toLowerCase()}`;
          if (el === panel) return 'the panel itself';
          return el.matches('input, select, textarea, button, a[href]')
            ? 'a control'
            : `a ${el.tagName.toLowerCase()}`;
        }),
      );
    }
    expect(landed).toEqual(Array<string>(count).fill('a control'));
  });
});
