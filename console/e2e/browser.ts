import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { expect } from 'vitest';

export const baseUrl = (() => {
  const url = process.env.LUMENWRIGHT_TEST_URL;
  if (!url) throw new Error('LUMENWRIGHT_TEST_URL is not set (the lead’s npm test sets it)');
  return url.replace(/\/$/, '');
})();

const artifacts = process.env.ARTIFACTS_DIR ?? path.join(os.tmpdir(), 'lumenwright-browser');

export interface Session {
  context: BrowserContext;
  page: Page;
  /** Console errors, page errors and failed same-origin responses seen so far. */
  errors: string[];
  close: () => Promise<void>;
}

/** A phone-sized screen (CSS pixels), as a mid-sized phone held upright. */
export const PHONE = { width: 390, height: 844 };

/**
 * A fresh chromium profile; every console error and uncaught exception is recorded. `mobile`
 * emulates a touch phone (meta viewport honoured, touch events) rather than a narrow window.
 */
export async function openBrowser(
  viewport = { width: 1280, height: 900 },
  opts: { allowStatuses?: number[]; mobile?: boolean } = {},
): Promise<Session> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'lw-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport,
    ...(opts.mobile ? { isMobile: true, hasTouch: true, deviceScaleFactor: 2 } : {}),
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  const allowed = new Set(opts.allowStatuses ?? []);
  page.on('console', (message) => {
    if (message.type() !== 'error') return;
    // Chromium also logs each non-2xx response here; those are checked below, with their URL.
    if (message.text().startsWith('Failed to load resource')) return;
    errors.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => errors.push(`pageerror: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() < 400 || allowed.has(response.status())) return;
    const request = response.request();
    const entry = `http ${response.status()}: ${request.method()} ${response.url()}`;
    errors.push(entry);
    // The problem body helps when a test fails; it is logged, not compared.
    response
      .text()
      .then((body) => console.error(`${entry} -> ${body.slice(0, 400)}`))
      .catch(() => undefined);
  });
  return {
    context,
    page,
    errors,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Where a test's screenshots and other by-products go (never committed). */
export function artifactPath(file: string): string {
  fs.mkdirSync(artifacts, { recursive: true });
  return path.join(artifacts, file);
}

export async function screenshot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: artifactPath(`${name}.png`), fullPage: true });
}

/**
 * The end of every test: a screenshot named after it, then no error may be left over except the
 * ones the test provoked on purpose (exact strings as recorded by openBrowser).
 */
export async function finishTest(session: Session, name: string, expected: string[] = []) {
  const { page } = session;
  await screenshot(page, name.replace(/[^a-z0-9]+/gi, '-').toLowerCase());
  // Leave the page so late responses are charged to this test, not the next one.
  await page.goto('about:blank');
  const seen = session.errors.splice(0).filter((error) => !expected.includes(error));
  expect(seen).toEqual([]);
}

/** How wide the page scrolls against the window: equal when nothing sticks out sideways. */
export function pageWidths(page: Page): Promise<{ scrollWidth: number; innerWidth: number }> {
  return page.evaluate(() => ({
    scrollWidth: (document.scrollingElement ?? document.documentElement).scrollWidth,
    innerWidth: window.innerWidth,
  }));
}

/** The demo studio's sign-ins, as `npm start` prints them (invented people). */
export function demoSignIn(role: 'owner' | 'admin' | 'developer' | 'photographer') {
  const file = new URL('../../scripts/demo-sign-ins.json', import.meta.url);
  const list = JSON.parse(fs.readFileSync(file, 'utf8')) as {
    role: string;
    email: string;
    password: string;
  }[];
  const found = list.find((entry) => entry.role === role);
  if (!found) throw new Error(`no demo sign-in for ${role}`);
  return found;
}

export async function signIn(page: Page, who: { email: string; password: string }) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('Email', { exact: true }).fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
}

/** A unique invented address per run (the domain is reserved for tests). */
export function uniqueEmail(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 6)}@studio.test`;
}

/** The password every signed-up test account gets. */
export const TEST_PASSWORD = 'lantern-dusk-2026!';

export async function signUp(page: Page, who: { name: string; studio: string; email: string }) {
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel('Your name').fill(who.name);
  await page.getByLabel('Studio name').fill(who.studio);
  await page.getByLabel('Email').fill(who.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
}

/** Opens the playground and returns its eight calculation tabs (their number checked). */
export async function playgroundTabs(page: Page): Promise<{ tabs: Locator; count: number }> {
  await page.goto(`${baseUrl}/playground`);
  await page.getByRole('heading', { level: 1, name: 'Playground' }).waitFor();
  const tabs = page.getByRole('tablist', { name: 'Calculations' }).getByRole('tab');
  const count = await tabs.count();
  expect(count).toBe(8);
  return { tabs, count };
}
