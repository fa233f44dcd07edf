import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  TEST_PASSWORD,
  baseUrl,
  finishTest,
  openBrowser,
  playgroundTabs,
  screenshot,
  signIn,
  signUp,
  uniqueEmail,
  type Session,
} from './browser';

const owner = {
  name: 'Odile Farrow',
  studio: 'Saltmarsh Dusk Portraits',
  email: uniqueEmail('odile'),
};

let session: Session;
let page: Page;
/** Failures a test provokes on purpose (exact strings as recorded by openBrowser). */
let expectedErrors: string[] = [];

/** Calls made this month as the Usage page reports them. */
async function usageCalls(): Promise<number> {
  await page.goto(`${baseUrl}/usage`);
  const total = page.getByTestId('usage-total');
  await total.waitFor();
  const text = (await total.textContent()) ?? '';
  return Number(text.split(' calls')[0]!.replace(/[^\d]/g, ''));
}

async function callWithKey(secret: string) {
  return fetch(`${baseUrl}/v1/flash`, {
    method: 'POST',
    headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
    body: JSON.stringify({ guideNumber: 32, distance: 2, aperture: 8 }),
  });
}

beforeAll(async () => {
  session = await openBrowser();
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

afterEach(async (context) => {
  const expected = expectedErrors;
  expectedErrors = [];
  await finishTest(session, context.task.name, expected);
});

describe('the console in a real browser', () => {
  it('signs up a new studio and lands on the overview', async () => {
    await page.goto(`${baseUrl}/`);
    // No session yet: GET /v1/me answers 401 and the gate sends us to sign in.
    expectedErrors = [`http 401: GET ${baseUrl}/v1/me`];
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await signUp(page, owner);
    await expect(page.title()).resolves.toBe('Overview · Lumenwright');
    await page.getByRole('heading', { name: 'This month' }).waitFor();
    await page.getByTestId('calls-chart').waitFor();
    const menu = page.getByRole('button', { name: new RegExp(owner.name) });
    await expect(menu.textContent()).resolves.toContain(owner.studio);
  });

  it('creates a key, shows its secret once, and revokes it (the API refuses it at once)', async () => {
    await page.goto(`${baseUrl}/`);
    await page.getByRole('link', { name: 'Keys' }).click();
    await page.getByRole('heading', { level: 1, name: 'Keys' }).waitFor();
    await page.getByRole('button', { name: 'Create key' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Gallery booking app');
    await dialog.getByRole('button', { name: 'Create key' }).click();
    const secretBox = page.getByTestId('key-secret');
    await secretBox.waitFor();
    const secret = await secretBox.inputValue();
    expect(secret).toMatch(/^lw_test_/);
    await expect(dialog.getByText(/shown only once/).isVisible()).resolves.toBe(true);
    await screenshot(page, 'key-secret-once');

    const before = await usageCalls();
    const works = await callWithKey(secret);
    expect(works.status).toBe(200);
    const after = await usageCalls();
    expect(after).toBeGreaterThan(before);

    await page.goto(`${baseUrl}/keys`);
    const row = page.getByRole('row', { name: /Gallery booking app/ });
    await row.waitFor();
    await row.getByRole('button', { name: 'Revoke Gallery booking app' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Revoke key' }).click();
    await row.getByText('revoked').waitFor();
    const refused = await callWithKey(secret);
    expect(refused.status).toBe(401);
    expect(refused.headers.get('content-type')).toContain('application/problem+json');
  });

  it('runs each playground calculation, sees its chart, and usage rises', async () => {
    const before = await usageCalls();
    const { tabs, count } = await playgroundTabs(page);
    const problems: string[] = [];
    for (let index = 0; index < count; index++) {
      const tab = tabs.nth(index);
      const label = (await tab.textContent()) ?? `tab-${index}`;
      await tab.click();
      const panel = page.locator('[role="tabpanel"]:visible');
      try {
        await panel.locator('[role="img"]').first().waitFor({ timeout: 20_000 });
      } catch {
        problems.push(`${label}: no chart or diagram`);
      }
      const confirmation = panel.locator('[data-confirmation]').first();
      try {
        await confirmation.waitFor({ timeout: 20_000 });
        await page.waitForFunction(
          (el) => el?.getAttribute('data-confirmation') !== 'waiting',
          await confirmation.elementHandle(),
          { timeout: 30_000 },
        );
        const state = await confirmation.getAttribute('data-confirmation');
        if (state !== 'agrees') problems.push(`${label}: API confirmation ${state}`);
      } catch {
        problems.push(`${label}: no API confirmation`);
      }
      await screenshot(page, `playground-${label.toLowerCase().replace(/\s+/g, '-')}`);
    }
    await page.waitForLoadState('networkidle');
    expect(problems).toEqual([]);
    const after = await usageCalls();
    expect(after).toBeGreaterThan(before);
  });

  it('saves a setup, finds, duplicates, prints and reopens it, then deletes the copy', async () => {
    await page.goto(`${baseUrl}/setups`);
    await page.getByRole('heading', { level: 1, name: 'Setups' }).waitFor();
    await page.getByRole('button', { name: 'Save a setup' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Boathouse steps at blue hour');
    await dialog.getByLabel('Venue (optional)').fill('Old boathouse');
    await dialog.getByLabel('Time zone').fill('Europe/Lisbon');
    await dialog.getByLabel('Latitude (°)').fill('38.70');
    await dialog.getByLabel('Longitude (°, east positive)').fill('-9.14');
    const inTenDays = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10);
    await dialog.getByLabel('Date').fill(inTenDays);
    await dialog.getByRole('button', { name: 'Save setup' }).click();
    await dialog.waitFor({ state: 'hidden' });

    // The overview lists it among the shoots coming up.
    await page.goto(`${baseUrl}/`);
    const upcoming = page.getByTestId('upcoming-shoots');
    await upcoming.getByText('Boathouse steps at blue hour').waitFor();
    expect(await upcoming.textContent()).toContain('Old boathouse');
    await page.goto(`${baseUrl}/setups`);
    await page.getByRole('heading', { level: 1, name: 'Setups' }).waitFor();

    await page.getByLabel('Search setups').fill('boathouse');
    await page.getByLabel('Search setups').press('Enter');
    await page.waitForURL(/q=boathouse/);
    const row = page.getByRole('row', { name: /Boathouse steps at blue hour/ }).first();
    await row.waitFor();

    await row.getByRole('button', { name: 'Duplicate Boathouse steps at blue hour' }).click();
    const copy = page.getByRole('row', { name: /Boathouse steps at blue hour \(copy\)/ });
    await copy.waitFor();

    const sheetHref = await row
      .getByRole('link', { name: /Shot sheet for Boathouse steps at blue hour/ })
      .getAttribute('href');
    const sheet = await page.request.get(`${baseUrl}${sheetHref}`);
    expect(sheet.status()).toBe(200);
    expect(sheet.headers()['content-type']).toContain('text/html');
    expect(await sheet.text()).toContain('Boathouse steps at blue hour');

    await copy.getByRole('button', { name: /^Delete / }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete setup' }).click();
    await copy.waitFor({ state: 'detached' });

    await row
      .getByRole('link', { name: 'Open Boathouse steps at blue hour in the playground' })
      .click();
    await page.waitForURL(/\/playground\?setup=[0-9a-f-]+&calc=setup/);
    await page.getByRole('heading', { level: 1, name: 'Playground' }).waitFor();
    await page.getByRole('tab', { name: 'Dusk setup', selected: true }).waitFor();
  });

  it('adds and edits a light in the gear list', async () => {
    await page.goto(`${baseUrl}/gear`);
    await page.getByRole('heading', { level: 1, name: 'Gear' }).waitFor();
    await page.getByRole('button', { name: 'Add light' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Pocket strobe B');
    await dialog.getByLabel('Guide number', { exact: true }).fill('36');
    await dialog.getByRole('button', { name: 'Save light' }).click();
    const row = page.getByRole('row', { name: /Pocket strobe B/ });
    await row.waitFor();
    await row.getByRole('button', { name: 'Edit Pocket strobe B' }).click();
    await page.getByRole('dialog').getByLabel('Guide number', { exact: true }).fill('42');
    await page.getByRole('dialog').getByRole('button', { name: 'Save light' }).click();
    await row.getByText(/^42 m/).waitFor();
  });

  it('renames the studio and the owner from the settings pages the user menu links', async () => {
    await page.goto(`${baseUrl}/`);
    const menu = page.getByRole('button', { name: new RegExp(owner.name) });
    await menu.click();
    await page.getByRole('menuitem', { name: 'Studio settings' }).click();
    await page.getByRole('heading', { level: 1, name: 'Studio settings' }).waitFor();
    await page.getByLabel('Studio name').fill('Saltmarsh Evening Studio');
    await page.getByRole('button', { name: 'Save studio name' }).click();
    await page.getByText('The studio’s name is saved.').waitFor();
    await expect(menu.textContent()).resolves.toContain('Saltmarsh Evening Studio');

    await menu.click();
    await page.getByRole('menuitem', { name: 'Account' }).click();
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    await page.getByLabel('Your name').fill('Odile Farrow-Lind');
    await page.getByRole('button', { name: 'Save name' }).click();
    await page.getByText('Your name is saved.').waitFor();
    await page.getByRole('button', { name: /Odile Farrow-Lind/ }).waitFor();
    // Both survive a reload: they came from the server, not from this page's state.
    await page.reload();
    const renamed = page.getByRole('button', { name: /Odile Farrow-Lind/ });
    await renamed.waitFor();
    await expect(renamed.textContent()).resolves.toContain('Saltmarsh Evening Studio');
    await page.getByRole('heading', { level: 2, name: 'Your studios' }).waitFor();
    await page.getByText('Saltmarsh Evening Studio', { exact: true }).waitFor();
    await screenshot(page, 'account');
  });

  it('reaches the navigation with the keyboard alone', async () => {
    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
    await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.textContent)).resolves.toBe(
      'Skip to content',
    );
    let reached = false;
    for (let i = 0; i < 15 && !reached; i++) {
      await page.keyboard.press('Tab');
      reached = await page.evaluate(
        () =>
          document.activeElement?.tagName === 'A' &&
          document.activeElement.textContent === 'Setups',
      );
    }
    expect(reached).toBe(true);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { level: 1, name: 'Setups' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/setups');
  });

  it('works at phone width: the menu folds and opens', async () => {
    const phone = await openBrowser({ width: 390, height: 844 });
    try {
      await signIn(phone.page, { email: owner.email, password: TEST_PASSWORD });
      const nav = phone.page.getByRole('navigation', { name: 'Primary' });
      await expect(nav.isVisible()).resolves.toBe(false);
      await phone.page.getByRole('button', { name: 'Menu' }).click();
      await nav.getByRole('link', { name: 'Setups' }).click();
      await phone.page.getByRole('heading', { level: 1, name: 'Setups' }).waitFor();
      const width = await phone.page.evaluate(() => document.documentElement.scrollWidth);
      expect(width).toBeLessThanOrEqual(390);
      await screenshot(phone.page, 'phone-setups');
      // The owner's other pages fit too, and each table's row actions are in view (rows become
      // cards on a phone): the Keys page's Revoke and the Team page's role select.
      for (const [route, heading] of [
        ['/team', 'Team'],
        ['/usage', 'Usage'],
        ['/keys', 'Keys'],
        ['/account', 'Account'],
        ['/studio', 'Studio settings'],
        ['/playground', 'Playground'],
      ] as const) {
        await phone.page.goto(`${baseUrl}${route}`);
        await phone.page.getByRole('heading', { level: 1, name: heading }).waitFor();
        const wide = await phone.page.evaluate(() => document.documentElement.scrollWidth);
        expect({ route, wide }).toEqual({ route, wide: 390 });
      }
      // Every calculation tab is on screen (they wrap), the Dusk setup one included.
      const tab = phone.page.getByRole('tab', { name: 'Dusk setup' });
      const box = await tab.boundingBox();
      expect(box && box.x >= 0 && box.x + box.width <= 390).toBe(true);
      expect(phone.errors).toEqual([]);
    } finally {
      await phone.close();
    }
  });
});
