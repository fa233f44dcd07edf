import fs from 'node:fs';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import {
  PHONE,
  artifactPath,
  baseUrl,
  demoSignIn,
  finishTest,
  openBrowser,
  pageWidths,
  screenshot,
  signIn,
  type Session,
} from './browser';

// A photographer plans a dusk portrait on a phone: the whole setup in the playground, saved with
// its details, found again, reopened, printed as a shot sheet, with feet remembered for the user.

const photographer = demoSignIn('photographer');
const run = Date.now().toString(36);
const plan = {
  name: `Harbour wall portrait ${run}`,
  venue: 'Gullstone harbour wall',
  date: '2026-09-18',
  notes: 'Couple on the wall; sandbag both stands, the wall is exposed to the sea breeze.',
};
/** Typed in metres; the 2-decimal feet are what the playground's unit toggle shows for them. */
const typed = {
  aperture: '4',
  isoMax: '3200',
  keyGuideNumber: '45',
  keyDistance: { m: '2.5', ft: '8.2' },
  keyAngle: '45',
  background: { m: '10', ft: '32.81' },
  rimGuideNumber: '36',
  rimBehind: { m: '2', ft: '6.56' },
  rimHeight: { m: '1.5', ft: '4.92' },
};

let session: Session;
let page: Page;
let savedId = '';

beforeAll(async () => {
  session = await openBrowser(PHONE, { mobile: true });
  page = session.page;
  await signIn(page, photographer);
});

afterAll(async () => {
  await session?.close();
});

afterEach(async (context) => {
  await finishTest(session, `phone-${context.task.name}`);
});

async function expectNoSidewaysScroll(target: Page, where: string) {
  const { scrollWidth, innerWidth } = await pageWidths(target);
  expect({ where, scrollWidth }).toEqual({ where, scrollWidth: Math.min(scrollWidth, innerWidth) });
  expect(innerWidth).toBe(PHONE.width);
}

const visiblePanel = () => page.locator('[role="tabpanel"]:visible');
const group = (name: string) => visiblePanel().getByRole('group', { name });
const lengthUnit = (target: Page, name: 'Metres' | 'Feet') =>
  target.getByRole('radio', { name }).getAttribute('aria-checked');

async function fill(scope: Locator, label: string, value: string) {
  await scope.getByLabel(label, { exact: true }).fill(value);
}

describe('a dusk portrait planned on a phone', () => {
  it('plans the whole setup in the playground, in metres then feet, and saves it', async () => {
    await page.goto(`${baseUrl}/playground?calc=twilight`);
    await page.getByRole('heading', { level: 1, name: 'Playground' }).waitFor();
    // Start from metres whatever an earlier run left saved (a no-op when already metres).
    await page.getByRole('radio', { name: 'Metres' }).click();
    await expect(lengthUnit(page, 'Metres')).resolves.toBe('true');

    const place = group('Place and date');
    await fill(place, 'Latitude (°N)', '44.05');
    await fill(place, 'Longitude (°E)', '9.85');
    await fill(place, 'Date', plan.date);
    await fill(place, 'Time zone', 'Europe/Rome');

    // Site conditions only change the cautions: by the water, with a breeze.
    // Open from the start: the safety questions come before any plan.
    await expect(
      page.locator('details', { hasText: 'Site conditions' }).getAttribute('open'),
    ).resolves.toBe('');
    await page.getByLabel('Near water').check();
    await page.getByLabel('Forecast wind (km/h)').fill('30');

    await page.getByRole('tab', { name: 'Dusk setup' }).click();
    const camera = group('Camera');
    await fill(camera, 'Aperture (f/)', typed.aperture);
    await fill(camera, 'Highest ISO', typed.isoMax);
    const key = group('Key light');
    await fill(key, 'Guide number', typed.keyGuideNumber);
    await fill(key, 'Distance (m)', typed.keyDistance.m);
    await fill(key, 'Angle from camera (°)', typed.keyAngle);
    await key.getByLabel('Modifier', { exact: true }).selectOption('umbrella');
    await fill(key, 'Key to background (m)', typed.background.m);
    const rim = group('Rim light');
    await fill(rim, 'Guide number', typed.rimGuideNumber);
    await fill(rim, 'Behind subject (m)', typed.rimBehind.m);
    await fill(rim, 'Height (m)', typed.rimHeight.m);
    await rim.getByLabel('Beam').selectOption('20');

    const result = visiblePanel().getByTestId('setup-plan');
    await result.waitFor();
    // The place and date typed on the Twilight tab reach the whole-setup calculation.
    await visiblePanel().getByText('44.050°, 9.850° on 2026-09-18 (Europe/Rome)').waitFor();
    // Both diagrams are drawn, and the cautions name the water and the wind.
    await expect(result.locator('svg[role="img"]').count()).resolves.toBe(2);
    const cautions = result.getByRole('complementary', { name: 'Safety cautions' });
    await cautions.waitFor();
    await expect(cautions.locator('[data-caution]').count()).resolves.toBeGreaterThan(1);
    const cautionText = (await cautions.textContent()) ?? '';
    expect(cautionText).toMatch(/water/i);
    expect(cautionText).toMatch(/wind/i);
    await screenshot(page, 'phone-setup-metres');

    await page.getByRole('radio', { name: 'Feet' }).click();
    await key.getByLabel('Distance (ft)').waitFor();
    await expect(key.getByLabel('Distance (ft)').inputValue()).resolves.toBe(typed.keyDistance.ft);
    await expect(key.getByLabel('Key to background (ft)').inputValue()).resolves.toBe(
      typed.background.ft,
    );
    await expect(rim.getByLabel('Behind subject (ft)').inputValue()).resolves.toBe(
      typed.rimBehind.ft,
    );
    await expect(rim.getByLabel('Height (ft)').inputValue()).resolves.toBe(typed.rimHeight.ft);
    await expect(lengthUnit(page, 'Feet')).resolves.toBe('true');
    await expectNoSidewaysScroll(page, 'playground');

    // Saved from the same page (a test ends on a blank page, which would lose the inputs).
    await visiblePanel().getByRole('button', { name: 'Save setup' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill(plan.name);
    await dialog.getByLabel('Venue (optional)').fill(plan.venue);
    await dialog.getByLabel('Date').fill(plan.date);
    await dialog.getByLabel('Notes (optional)').fill(plan.notes);
    await expectNoSidewaysScroll(page, 'save dialog');
    await dialog.getByRole('button', { name: 'Save setup' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await visiblePanel()
      .getByText(`Saved setup ${plan.name} (${plan.venue}, ${plan.date}).`)
      .waitFor();

    await visiblePanel().getByRole('link', { name: 'See it in Setups' }).click();
    await page.getByRole('heading', { level: 1, name: 'Setups' }).waitFor();
    await page.getByLabel('Search setups').fill(plan.name);
    await page.getByLabel('Search setups').press('Enter');
    const row = page.getByRole('row', { name: new RegExp(plan.name) });
    await row.waitFor();
    await expect(row.textContent()).resolves.toContain(plan.venue);
    await expectNoSidewaysScroll(page, 'setups');
    const open = await row
      .getByRole('link', { name: `Open ${plan.name} in the playground` })
      .getAttribute('href');
    savedId = /setup=([0-9a-f-]+)/.exec(open ?? '')?.[1] ?? '';
    expect(savedId).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('reopens the saved setup in the playground with the same inputs', async () => {
    await page.goto(`${baseUrl}/setups?q=${encodeURIComponent(plan.name)}`);
    const row = page.getByRole('row', { name: new RegExp(plan.name) });
    await row.getByRole('link', { name: `Open ${plan.name} in the playground` }).click();
    await page.waitForURL(new RegExp(`/playground\\?setup=${savedId}&calc=setup`));
    await visiblePanel().getByText(`Opened saved setup ${plan.name}`).waitFor();
    const key = group('Key light');
    await expect(key.getByLabel('Distance (ft)').inputValue()).resolves.toBe(typed.keyDistance.ft);

    const values = async (scope: Locator, labels: string[]) =>
      Promise.all(labels.map((label) => scope.getByLabel(label, { exact: true }).inputValue()));
    await expect(values(group('Camera'), ['Aperture (f/)', 'Highest ISO'])).resolves.toEqual([
      typed.aperture,
      typed.isoMax,
    ]);
    await expect(
      values(key, [
        'Guide number',
        'Distance (ft)',
        'Angle from camera (°)',
        'Modifier',
        'Key to background (ft)',
      ]),
    ).resolves.toEqual([
      typed.keyGuideNumber,
      typed.keyDistance.ft,
      typed.keyAngle,
      'umbrella',
      typed.background.ft,
    ]);
    await expect(
      values(group('Rim light'), ['Guide number', 'Behind subject (ft)', 'Height (ft)', 'Beam']),
    ).resolves.toEqual([typed.rimGuideNumber, typed.rimBehind.ft, typed.rimHeight.ft, '20']);
    await visiblePanel().getByText('44.050°, 9.850° on 2026-09-18 (Europe/Rome)').waitFor();
    await visiblePanel().getByTestId('setup-plan').locator('svg[role="img"]').first().waitFor();
    await expectNoSidewaysScroll(page, 'reopened playground');
  });

  it('prints the shot sheet: plan, diagram and cautions, to a PDF', async () => {
    await page.goto(`${baseUrl}/setups?q=${encodeURIComponent(plan.name)}`);
    const link = page
      .getByRole('row', { name: new RegExp(plan.name) })
      .getByRole('link', { name: `Shot sheet for ${plan.name} (opens a new tab)` });
    const href = await link.getAttribute('href');
    expect(href).toBe(`/v1/setups/${savedId}/sheet`);
    // Opened here rather than in a new tab, so this page's error watch covers it.
    await page.goto(`${baseUrl}${href}`);
    await page.getByRole('heading', { level: 1, name: plan.name }).waitFor();
    await expectNoSidewaysScroll(page, 'shot sheet');
    // The suggested minutes are cards on a phone: nothing to scroll inside their box either.
    const minutesBox = await page
      .locator('.table-scroll:has(table.minutes)')
      .evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
    expect(minutesBox.scroll).toBeLessThanOrEqual(minutesBox.client);
    const firstMinute = page.locator('table.minutes tbody tr').first();
    await expect(
      firstMinute
        .locator('td')
        .nth(4)
        .evaluate((el) => getComputedStyle(el, '::before').content),
    ).resolves.toBe('"Key power"');

    const html = await page.content();
    expect(html).toContain(plan.venue);
    expect(html).toContain(plan.notes);
    for (const heading of ['Timing', 'Suggested minutes', 'Key light', 'Rim light', 'Safety'])
      await page.getByRole('heading', { level: 2, name: heading }).waitFor();
    // The plan, in the feet it was saved in.
    expect(html).toContain(`${typed.keyDistance.ft} ft · ${typed.keyAngle}° from the camera axis`);
    expect(html).toContain(`${typed.rimBehind.ft} ft behind, ${typed.rimHeight.ft} ft high`);
    const diagram = page.locator('svg').first();
    await expect(diagram.locator('text').count()).resolves.toBeGreaterThan(0);
    const safety = (await page.locator('#cautions').textContent()) ?? '';
    expect(safety).toMatch(/water/i);
    expect(safety).toMatch(/wind/i);
    expect(safety).toContain('Local codes, venue rules');

    await page.emulateMedia({ media: 'print' });
    await expect(
      page
        .locator('.print-hint')
        .first()
        .evaluate((el) => getComputedStyle(el).display),
    ).resolves.toBe('none');
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    fs.writeFileSync(artifactPath('phone-shot-sheet.pdf'), pdf);
    console.log(`shot sheet PDF: ${pdf.length} bytes`);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.length).toBeGreaterThan(20_000);
    const pages = pdf.toString('latin1').match(/\/Type\s*\/Page\b/g) ?? [];
    expect(pages.length).toBeGreaterThanOrEqual(1);
    expect(pages.length).toBeLessThanOrEqual(3);
    await page.emulateMedia({ media: 'screen' });
  });

  it('keeps feet for the user in a new browser', async () => {
    const other = await openBrowser(PHONE, { mobile: true });
    try {
      await signIn(other.page, photographer);
      await other.page.goto(`${baseUrl}/playground?calc=setup`);
      await other.page.getByRole('heading', { level: 1, name: 'Playground' }).waitFor();
      await other.page.getByLabel('Distance (ft)').waitFor();
      await expect(lengthUnit(other.page, 'Feet')).resolves.toBe('true');
      await expect(
        other.page.evaluate(() => window.localStorage.getItem('lumenwright.length-unit')),
      ).resolves.toBe('ft');
      await screenshot(other.page, 'phone-new-browser-feet');
      expect(other.errors).toEqual([]);
    } finally {
      await other.close();
    }
  });
});
