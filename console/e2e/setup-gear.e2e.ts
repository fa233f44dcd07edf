import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import {
  baseUrl,
  finishTest,
  openBrowser,
  screenshot,
  signUp,
  uniqueEmail,
  type Session,
} from './browser';

// A Dusk setup planned with a light and a modifier from the studio's gear, saved, reopened from
// the Setups page with its picks restored, saved again: both saved setups still name the gear by
// id (read back through the API). A studio of its own, so its gear list holds only this run's.

const owner = {
  name: 'Ines Varga',
  studio: 'Quayside Evening Portraits',
  email: uniqueEmail('ines'),
};
const run = Date.now().toString(36);
const names = { first: `Quay steps ${run}`, again: `Quay steps again ${run}` };
const gear = {
  light: { name: 'Lantern pack', guideNumber: '48' },
  modifier: { name: 'Square box', kind: 'softbox', lossStops: '1.2', size: '0.9' },
};

let session: Session;
let page: Page;
const ids = { light: '', modifier: '' };

beforeAll(async () => {
  session = await openBrowser();
  page = session.page;
  await signUp(page, owner);
});

afterAll(async () => {
  await session?.close();
});

afterEach(async (context) => {
  await finishTest(session, `setup-gear-${context.task.name}`);
});

const visiblePanel = () => page.locator('[role="tabpanel"]:visible');
const group = (name: string) => visiblePanel().getByRole('group', { name });

async function fill(scope: Locator, label: string, value: string) {
  await scope.getByLabel(label, { exact: true }).fill(value);
}

/** GET through the browser's session (same cookies as the console). */
async function apiGet<T>(path: string): Promise<T> {
  const response = await page.request.get(`${baseUrl}${path}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as T;
}

type Part = Record<string, unknown>;
interface Saved {
  id: string;
  name: string;
  inputs: { key: Part; rim?: Part };
}

/** The saved setup of that name, as GET /v1/setups/{id} answers it. */
async function savedNamed(name: string): Promise<Saved> {
  const list = await apiGet<{ data: { id: string; name: string }[] }>(
    `/v1/setups?q=${encodeURIComponent(name)}`,
  );
  const found = list.data.find((s) => s.name === name);
  expect(found, name).toBeDefined();
  return apiGet<Saved>(`/v1/setups/${found!.id}`);
}

async function saveAs(name: string) {
  await visiblePanel().getByRole('button', { name: 'Save setup' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Name').fill(name);
  await dialog.getByRole('button', { name: 'Save setup' }).click();
  await dialog.waitFor({ state: 'hidden' });
  await visiblePanel().getByText(`Saved setup ${name}`).waitFor();
}

describe('a Dusk setup planned with the studio’s gear', () => {
  it('adds a light and a modifier to the gear list', async () => {
    await page.goto(`${baseUrl}/gear`);
    await page.getByRole('heading', { level: 1, name: 'Gear' }).waitFor();
    await page.getByRole('button', { name: 'Add light' }).click();
    let dialog = page.getByRole('dialog');
    await fill(dialog, 'Name', gear.light.name);
    await fill(dialog, 'Guide number', gear.light.guideNumber);
    await dialog.getByRole('button', { name: 'Save light' }).click();
    await page.getByRole('row', { name: new RegExp(gear.light.name) }).waitFor();

    await page.getByRole('button', { name: 'Add modifier' }).click();
    dialog = page.getByRole('dialog');
    await fill(dialog, 'Name', gear.modifier.name);
    await dialog.getByLabel('Kind').selectOption(gear.modifier.kind);
    await fill(dialog, 'Light loss (stops)', gear.modifier.lossStops);
    await fill(dialog, 'Size (optional)', gear.modifier.size);
    await dialog.getByRole('button', { name: 'Save modifier' }).click();
    await page.getByRole('row', { name: new RegExp(gear.modifier.name) }).waitFor();

    const lights = await apiGet<{ data: { id: string; name: string }[] }>('/v1/gear/lights');
    const modifiers = await apiGet<{ data: { id: string; name: string }[] }>('/v1/gear/modifiers');
    ids.light = lights.data.find((l) => l.name === gear.light.name)?.id ?? '';
    ids.modifier = modifiers.data.find((m) => m.name === gear.modifier.name)?.id ?? '';
    expect(ids.light).toMatch(/^[0-9a-f-]{36}$/);
    expect(ids.modifier).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('saves a setup with the key light and modifier picked from the gear', async () => {
    await page.goto(`${baseUrl}/playground?calc=twilight`);
    await page.getByRole('heading', { level: 1, name: 'Playground' }).waitFor();
    await page.getByRole('radio', { name: 'Metres' }).click();
    const place = group('Place and date');
    await fill(place, 'Latitude (°N)', '38.72');
    await fill(place, 'Longitude (°E)', '-9.14');
    await fill(place, 'Date', '2026-10-02');
    await fill(place, 'Time zone', 'Europe/Lisbon');

    await page.getByRole('tab', { name: 'Dusk setup' }).click();
    const key = group('Key light');
    await key.getByLabel('Key light from your gear').selectOption(ids.light);
    await key.getByLabel('Key modifier from your gear').selectOption(ids.modifier);
    await expect(key.getByLabel('Guide number', { exact: true }).inputValue()).resolves.toBe('48');
    await expect(key.getByLabel('Modifier loss (stops)').inputValue()).resolves.toBe('1.2');
    await expect(key.getByLabel('Modifier size (m)').inputValue()).resolves.toBe('0.9');
    await visiblePanel().getByTestId('setup-plan').waitFor();
    await saveAs(names.first);
  });

  it('reopens it from the Setups page with the picks restored, and saves it again', async () => {
    await page.goto(`${baseUrl}/setups?q=${encodeURIComponent(names.first)}`);
    const row = page.getByRole('row', { name: new RegExp(names.first) });
    await row.getByRole('link', { name: `Open ${names.first} in the playground` }).click();
    await page.waitForURL(/\/playground\?setup=[0-9a-f-]+&calc=setup/);
    await visiblePanel().getByText(`Opened saved setup ${names.first}`).waitFor();

    const key = group('Key light');
    // The pickers show the gear again (not their "Choose…" placeholder): the links came back.
    await expect
      .poll(() => key.getByLabel('Key light from your gear').inputValue())
      .toBe(ids.light);
    await expect(key.getByLabel('Key modifier from your gear').inputValue()).resolves.toBe(
      ids.modifier,
    );
    await expect(key.getByLabel('Guide number', { exact: true }).inputValue()).resolves.toBe('48');
    await expect(visiblePanel().getByTestId('gear-changed').count()).resolves.toBe(0);
    await expect(visiblePanel().getByTestId('gear-missing').count()).resolves.toBe(0);
    await screenshot(page, 'setup-gear-reopened');
    await saveAs(names.again);
  });

  it('reads both saved setups back through the API, each naming the gear by id', async () => {
    for (const name of [names.first, names.again]) {
      const saved = await savedNamed(name);
      expect({ name, key: saved.inputs.key }).toMatchObject({
        name,
        key: { lightId: ids.light, modifierId: ids.modifier },
      });
      // Named by id, not copied: the values the gear stands for are not saved beside it.
      expect(saved.inputs.key).not.toHaveProperty('guideNumber');
      expect(saved.inputs.key).not.toHaveProperty('modifierLossStops');
    }
  });
});
