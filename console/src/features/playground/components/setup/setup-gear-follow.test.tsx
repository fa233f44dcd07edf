import { QueryClient, QueryClientProvider, focusManager } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { SessionContext } from '@/lib/session';
import { demoSession, recordFetch, type RecordedCall } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { GEAR_LISTS_FRESH_MS } from '../../api/gear-options';
import { Playground } from '../playground';
import { SETUP_DEFAULTS } from './setup-form';

// Picked gear edited or deleted elsewhere (another tab) between picking and saving. The studio's
// gear below is invented; the stubbed API answers with it as it is at the time of each request.

const id = (n: number) => `c3d1e5f7-0000-4000-8000-00000000000${n}`;
type Gear = {
  lights: Record<string, unknown>[];
  modifiers: Record<string, unknown>[];
  gelKits: Record<string, unknown>[];
};
let gear: Gear;
const piece = (n: number, name: string, miredShift: number, position: number) => ({
  id: id(n),
  name,
  miredShift,
  greenShift: 0,
  lossStops: 0.4,
  position,
});

let calls: RecordedCall[];
/** While true the gear lists answer 503, as when the API is briefly unreachable. */
let gearDown: boolean;
/** How far the clock TanStack Query reads (Date.now) is moved ahead of the real one. */
let clockAhead: number;

beforeEach(() => {
  gearDown = false;
  clockAhead = 0;
  const realNow = Date.now.bind(Date);
  vi.spyOn(Date, 'now').mockImplementation(() => realNow() + clockAhead);
  gear = {
    lights: [{ id: id(1), name: 'Porch pack', guideNumber: 58, guideNumberUnit: 'm' }],
    modifiers: [
      {
        id: id(2),
        name: 'Deep box',
        kind: 'softbox',
        lossStops: 1.3,
        size: null,
        sizeUnit: null,
        beamAngleDeg: null,
      },
    ],
    gelKits: [
      {
        id: id(3),
        name: 'Dusk pouch',
        notes: null,
        pieces: [piece(4, 'Amber half', 80, 0), piece(5, 'Amber quarter', 40, 1)],
      },
    ],
  };
  calls = recordFetch((call) => {
    if (gearDown && call.path.startsWith('/v1/gear/'))
      return jsonResponse(
        { title: 'Service Unavailable', status: 503, detail: 'The database is not answering.' },
        503,
        'application/problem+json',
      );
    if (call.path === '/v1/gear/lights') return jsonResponse({ data: gear.lights });
    if (call.path === '/v1/gear/modifiers') return jsonResponse({ data: gear.modifiers });
    if (call.path === '/v1/gear/gel-kits') return jsonResponse({ data: gear.gelKits });
    if (call.method === 'POST' && call.path === '/v1/setups')
      return jsonResponse({ id: id(9), name: 'Porch', date: '2026-06-20' }, 201);
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
});

afterEach(() => focusManager.setFocused(undefined));

async function open(calc: 'setup' | 'flash') {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <SessionContext.Provider value={{ ...demoSession, role: 'photographer' }}>
        <MemoryRouter initialEntries={[`/playground?calc=${calc}`]}>
          <Playground />
        </MemoryRouter>
      </SessionContext.Provider>
    </QueryClientProvider>,
  );
  const panel = await screen.findByRole('tabpanel');
  return { panel, group: (name: string) => within(panel).getByRole('group', { name }) };
}

const valueOf = (element: HTMLElement) => (element as HTMLInputElement).value;
const pick = async (scope: HTMLElement, label: string, value: string) =>
  fireEvent.change(await within(scope).findByLabelText(label), { target: { value } });
const gearFetches = () => calls.filter((c) => c.path.startsWith('/v1/gear/')).length;

/** Leave the window and come back. */
function switchWindows() {
  act(() => {
    focusManager.setFocused(false);
    focusManager.setFocused(true);
  });
}

/**
 * Come back after longer than the lists stay current, as after editing the gear in another tab:
 * the lists refetch.
 */
async function returnToWindow() {
  const before = gearFetches();
  clockAhead += GEAR_LISTS_FRESH_MS + 1_000;
  switchWindows();
  await waitFor(() => expect(gearFetches()).toBeGreaterThanOrEqual(before + 3));
}

/** Let requests a refetch would start get under way. */
const settle = () => act(() => new Promise((resolve) => setTimeout(resolve, 50)));

type Saved = {
  key: Record<string, unknown>;
  rim?: Record<string, unknown>;
  gels?: unknown;
  gelKitId?: string;
};
const setupPosts = () => calls.filter((c) => c.method === 'POST' && c.path === '/v1/setups');

/** Save through the dialog; answers the inputs sent, or the dialog's message when none was sent. */
async function save(panel: HTMLElement): Promise<Saved> {
  const before = setupPosts().length;
  fireEvent.click(within(panel).getByRole('button', { name: 'Save setup' }));
  const dialog = await screen.findByRole('dialog');
  fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Porch' } });
  fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
  await waitFor(() => expect(setupPosts().length).toBe(before + 1));
  return (setupPosts().at(-1)!.body as { inputs: Saved }).inputs;
}

describe('Dusk setup: picked gear that changes before saving', () => {
  it('says a key light was edited, saves the values shown without its id, and refills on request', async () => {
    const { panel, group } = await open('setup');
    await pick(group('Key light'), 'Key light from your gear', id(1));
    expect(valueOf(within(group('Key light')).getByLabelText('Guide number'))).toBe('58');
    gear.lights[0] = { ...gear.lights[0], guideNumber: 64 };
    await returnToWindow();
    const note = await within(group('Key light')).findByTestId('gear-pick-changed');
    expect(note.textContent).toContain('Porch pack');
    expect(note.textContent).toContain('guide number is now 64.0 m (was 58.0 m)');
    // The box still holds 58: saving must not name the light, whose guide number is 64 now.
    const first = await save(panel);
    expect(first.key).not.toHaveProperty('lightId');
    expect(first.key).toMatchObject({ guideNumber: 58, guideNumberUnit: 'm' });

    fireEvent.click(within(note).getByRole('button', { name: 'Use the new values' }));
    expect(valueOf(within(group('Key light')).getByLabelText('Guide number'))).toBe('64');
    expect(within(group('Key light')).queryByTestId('gear-pick-changed')).toBeNull();
    const second = await save(panel);
    expect(second.key).toMatchObject({ lightId: id(1) });
    expect(second.key).not.toHaveProperty('guideNumber');
  });

  it('drops the link to an edited modifier on "Keep my values", keeping the boxes', async () => {
    const { panel, group } = await open('setup');
    await pick(group('Key light'), 'Key modifier from your gear', id(2));
    gear.modifiers[0] = { ...gear.modifiers[0], lossStops: 1.7, kind: 'octabox' };
    await returnToWindow();
    const note = await within(group('Key light')).findByTestId('gear-pick-changed');
    expect(note.textContent).toContain('kind is now octabox (was softbox)');
    expect(note.textContent).toContain('loss is now 1.7 stops (was 1.3)');
    fireEvent.click(within(note).getByRole('button', { name: 'Keep my values' }));
    expect(within(group('Key light')).queryByTestId('gear-pick-changed')).toBeNull();
    expect(valueOf(within(group('Key light')).getByLabelText('Modifier loss (stops)'))).toBe('1.3');
    const inputs = await save(panel);
    expect(inputs.key).not.toHaveProperty('modifierId');
    expect(inputs.key).toMatchObject({ modifier: 'softbox', modifierLossStops: 1.3 });
  });

  it('says a picked rim light was deleted and saves its values without the id', async () => {
    const { panel, group } = await open('setup');
    await pick(group('Rim light'), 'Rim light from your gear', id(1));
    await pick(group('Key light'), 'Key modifier from your gear', id(2));
    gear.lights = [];
    await returnToWindow();
    const note = await within(group('Rim light')).findByTestId('gear-pick-deleted');
    expect(note.textContent).toContain('The rim light Porch pack was deleted');
    const inputs = await save(panel);
    expect(inputs.rim).not.toHaveProperty('lightId');
    expect(inputs.rim).toMatchObject({ guideNumber: 58, guideNumberUnit: 'm' });
    // The modifier, unchanged, keeps its link.
    expect(inputs.key).toMatchObject({ modifierId: id(2) });
  });

  it('keeps planning with a changed gel kit’s gels as picked, saved as a list, until asked', async () => {
    const { panel, group } = await open('setup');
    await pick(group('Camera'), 'Gel kit from your gear', id(3));
    gear.gelKits[0] = {
      ...gear.gelKits[0],
      pieces: [
        piece(4, 'Amber half', 80, 0),
        piece(5, 'Amber quarter', 40, 1),
        piece(6, 'Amber eighth', 20, 2),
      ],
    };
    await returnToWindow();
    const note = await within(group('Camera')).findByTestId('gear-pick-changed');
    expect(note.textContent).toContain('it has 3 gels now (was 2)');
    const first = await save(panel);
    expect(first).not.toHaveProperty('gelKitId');
    expect(first.gels).toEqual([
      { name: 'Amber half', miredShift: 80, greenShift: 0, lossStops: 0.4 },
      { name: 'Amber quarter', miredShift: 40, greenShift: 0, lossStops: 0.4 },
    ]);
    fireEvent.click(within(note).getByRole('button', { name: 'Use its gels now' }));
    const second = await save(panel);
    expect(second.gelKitId).toBe(id(3));
    expect(second).not.toHaveProperty('gels');
  });

  it('fetches the gear again when saving and stops when a picked item changed unseen', async () => {
    const { panel, group } = await open('setup');
    await pick(group('Key light'), 'Key light from your gear', id(1));
    // Deleted elsewhere while this window kept the focus: the lists here have not refetched.
    gear.lights = [];
    fireEvent.click(within(panel).getByRole('button', { name: 'Save setup' }));
    const dialog = await screen.findByRole('dialog');
    fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Porch' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
    expect(await within(dialog).findByText(/gear changed since you picked from it/)).toBeTruthy();
    expect(setupPosts()).toHaveLength(0);
    // (The dialog hides the form from the accessibility tree, so the note is found by its id.)
    expect(await within(panel).findByTestId('gear-pick-deleted')).toBeTruthy();
    // Saving again sends the values shown, without the id of the deleted light.
    fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
    await waitFor(() => expect(setupPosts()).toHaveLength(1));
    const { inputs } = setupPosts()[0]!.body as { inputs: Saved };
    expect(inputs.key).not.toHaveProperty('lightId');
    expect(inputs.key).toMatchObject({ guideNumber: 58 });
  });
});

describe('Dusk setup: the gear lists cannot be fetched when saving', () => {
  it('saves nothing, says so with a retry, keeps every entry, and saves on “Try again”', async () => {
    const { panel, group } = await open('setup');
    await pick(group('Key light'), 'Key light from your gear', id(1));
    // Held now: while the dialog is open the form is out of the accessibility tree.
    const distance = within(group('Key light')).getByLabelText('Distance (m)');
    const guideNumber = within(group('Key light')).getByLabelText('Guide number');
    fireEvent.change(distance, { target: { value: '3.5' } });
    gearDown = true;

    fireEvent.click(within(panel).getByRole('button', { name: 'Save setup' }));
    const dialog = await screen.findByRole('dialog');
    fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Porch' } });
    fireEvent.change(within(dialog).getByLabelText('Venue (optional)'), {
      target: { value: 'Harbour steps' },
    });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));

    const alert = await within(dialog).findByRole('alert');
    expect(alert.textContent).toContain('could not be checked before saving');
    expect(alert.textContent).toContain('The database is not answering');
    expect(alert.textContent).toContain('Nothing was saved');
    expect(setupPosts()).toHaveLength(0);
    // Everything typed is still there: the dialog's boxes and the playground's.
    expect(valueOf(within(dialog).getByLabelText('Name'))).toBe('Porch');
    expect(valueOf(within(dialog).getByLabelText('Venue (optional)'))).toBe('Harbour steps');
    expect(valueOf(distance)).toBe('3.5');
    expect(valueOf(guideNumber)).toBe('58');

    // Back up: "Try again" checks the gear and saves what was typed, the light named by id.
    gearDown = false;
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    await waitFor(() => expect(setupPosts()).toHaveLength(1));
    const body = setupPosts()[0]!.body as { name: string; venue: string; inputs: Saved };
    expect(body).toMatchObject({ name: 'Porch', venue: 'Harbour steps' });
    expect(body.inputs.key).toMatchObject({ lightId: id(1), distance: 3.5 });
  });

  it('saves as usual with nothing picked from the gear: there is no id to check', async () => {
    const { panel } = await open('setup');
    await waitFor(() => expect(gearFetches()).toBe(3));
    gearDown = true;
    const inputs = await save(panel);
    expect(inputs.key).toMatchObject({ guideNumber: SETUP_DEFAULTS.keyGuideNumber });
    expect(inputs.key).not.toHaveProperty('lightId');
    // The save did not ask for the lists.
    expect(gearFetches()).toBe(3);
  });
});

describe('Gear lists and window focus', () => {
  it('does not refetch on a quick return to the window, and does once the lists are old', async () => {
    const { group } = await open('setup');
    await waitFor(() => expect(gearFetches()).toBe(3));
    await pick(group('Key light'), 'Key light from your gear', id(1));
    gear.lights[0] = { ...gear.lights[0], guideNumber: 64 };

    // A few seconds away: no requests, and the edit is not seen yet.
    clockAhead += 5_000;
    switchWindows();
    await settle();
    expect(gearFetches()).toBe(3);
    expect(within(group('Key light')).queryByTestId('gear-pick-changed')).toBeNull();

    // Back after the lists have aged past GEAR_LISTS_FRESH_MS: one fetch of each, edit seen.
    await returnToWindow();
    await settle();
    expect(gearFetches()).toBe(6);
    expect(await within(group('Key light')).findByTestId('gear-pick-changed')).toBeTruthy();
  });
});

describe('Flash: picked gear that changes', () => {
  it('says the picked light was edited and refills from it on request', async () => {
    const { group } = await open('flash');
    await pick(group('Key light'), 'Light from your gear', id(1));
    gear.lights[0] = { ...gear.lights[0], guideNumber: 44, guideNumberUnit: 'ft' };
    await returnToWindow();
    const note = await within(group('Key light')).findByTestId('gear-pick-changed');
    expect(note.textContent).toContain('guide number is now 44.0 ft (was 58.0 m)');
    expect(valueOf(within(group('Key light')).getByLabelText('Guide number (ISO 100)'))).toBe('58');
    fireEvent.click(within(note).getByRole('button', { name: 'Use the new values' }));
    expect(valueOf(within(group('Key light')).getByLabelText('Guide number (ISO 100)'))).toBe('44');
    expect(valueOf(within(group('Key light')).getByLabelText('Guide number in'))).toBe('ft');
  });

  it('says the picked modifier was deleted', async () => {
    const { group } = await open('flash');
    await pick(group('Key light'), 'Modifier from your gear', id(2));
    gear.modifiers = [];
    await returnToWindow();
    const note = await within(group('Key light')).findByTestId('gear-pick-deleted');
    expect(note.textContent).toContain('The modifier Deep box was deleted');
    expect(valueOf(within(group('Key light')).getByLabelText('Modifier loss (stops)'))).toBe('1.3');
  });
});
