import fs from 'node:fs';
import { createRequire } from 'node:module';
import type { AxeResults } from 'axe-core';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, demoSignIn, finishTest, openBrowser, signIn, type Session } from './browser';

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

async function auditConsole(theme: 'day' | 'night'): Promise<Finding[]> {
  const findings: Finding[] = [];
  const visited: string[] = [];
  const check = async (where: string) => {
    visited.push(where);
    findings.push(...(await audit(`${where} (${theme})`)));
  };

  // Signed out: the theme is a stored preference, so it applies here too.
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/sign-in`);
  await page.evaluate((t) => window.localStorage.setItem('lumenwright.theme', t), theme);
  await page.reload();
  await settle('Sign in');
  await expect(page.evaluate(() => document.documentElement.dataset.theme)).resolves.toBe(theme);
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
  expect(count).toBe(7);
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

  // Sign-in, sign-up, nine pages, keys and its dialog, seven tabs.
  expect(visited).toHaveLength(20);
  return findings;
}

describe('accessibility (axe-core, WCAG 2.1 A and AA)', () => {
  for (const theme of ['day', 'night'] as const) {
    it(`every console page in the ${theme} theme`, async () => {
      // Signed out on purpose: the session check answers 401 before the sign-in page shows.
      expectedErrors = [`http 401: GET ${baseUrl}/v1/me`];
      const findings = await auditConsole(theme);
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
