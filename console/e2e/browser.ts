import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

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

/** A fresh chromium profile; every console error and uncaught exception is recorded. */
export async function openBrowser(
  viewport = { width: 1280, height: 900 },
  opts: { allowStatuses?: number[] } = {},
): Promise<Session> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'lw-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport,
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

export async function screenshot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(artifacts, { recursive: true });
  await page.screenshot({ path: path.join(artifacts, `${name}.png`), fullPage: true });
}

/** A unique invented address per run (the domain is reserved for tests). */
export function uniqueEmail(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 6)}@studio.test`;
}

export async function signUp(page: Page, who: { name: string; studio: string; email: string }) {
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel('Your name').fill(who.name);
  await page.getByLabel('Studio name').fill(who.studio);
  await page.getByLabel('Email').fill(who.email);
  await page.getByLabel('Password').fill('lantern-dusk-2026!');
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
}
