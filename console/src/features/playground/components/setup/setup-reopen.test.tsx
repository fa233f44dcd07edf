import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { beforeEach, describe, expect, it } from 'vitest';
import { SessionContext } from '@/lib/session';
import { demoSession, recordFetch, type RecordedCall } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { Playground } from '../playground';

// Reopening a saved setup: gear links come back as picks, values and beams as saved.
// Invented studio gear and an invented evening (names of our own, no products or places).

const id = (n: number) => `c3d1e5f7-0000-4000-8000-00000000000${n}`;
const SETUP_ID = id(0);
const light = { id: id(1), name: 'Garden strobe', guideNumber: 36, guideNumberUnit: 'ft' };
const pack = { id: id(2), name: 'Big pack', guideNumber: 58, guideNumberUnit: 'm' };
const octa = { id: id(3), name: 'Wide octa', kind: 'octabox', lossStops: 2.2, size: 4 };
const grid = {
  id: id(4),
  name: 'Tight grid',
  kind: 'grid',
  lossStops: 0.7,
  beamAngleDeg: 25,
  size: null,
  sizeUnit: null,
};
const pieces = [
  { id: id(7), name: 'Warm half', miredShift: 80, greenShift: 0, lossStops: 0.5, position: 1 },
  { id: id(8), name: 'Warm quarter', miredShift: 40, greenShift: 1, lossStops: 0.3, position: 0 },
];
const kit = { id: id(6), name: 'Warm pouch', notes: null, pieces };
const fullGear = {
  lights: [light, pack],
  modifiers: [{ ...octa, sizeUnit: 'ft', beamAngleDeg: null }, grid],
  gelKits: [kit],
};

const place = {
  latitude: 51.3,
  longitude: 4.9,
  date: '2026-08-14',
  timeZone: 'Europe/Brussels',
  sky: 'clear',
};
const camera = { aperture: 4, isoMax: 3200, support: 'tripod' };

/** As the client saved it: gear named by id. */
const linkedInputs = {
  ...place,
  camera,
  key: { lightId: pack.id, modifierId: octa.id, distance: 3, distanceUnit: 'm' },
  rim: {
    lightId: light.id,
    modifierId: grid.id,
    distanceBehind: 2.5,
    lightHeight: 1.2,
    distanceUnit: 'm',
  },
  gelKitId: kit.id,
};

/**
 * As the server resolved it (gear-reference.resolver.ts): the ids replaced by the gear's values.
 * The octa's 4 ft is 1.2192 m (1 ft = 0.3048 m exactly, international yard and pound, 1959).
 */
const resolvedInputs = {
  ...place,
  camera,
  key: {
    distance: 3,
    distanceUnit: 'm',
    guideNumber: 58,
    guideNumberUnit: 'm',
    modifier: 'octabox',
    modifierLossStops: 2.2,
    modifierSize: 1.2192,
  },
  rim: {
    distanceBehind: 2.5,
    lightHeight: 1.2,
    distanceUnit: 'm',
    guideNumber: 36,
    guideNumberUnit: 'ft',
    modifierLossStops: 0.7,
    beamAngleDeg: 25,
  },
  // The kit's pieces in its order (`position`).
  gels: [
    { name: 'Warm quarter', miredShift: 40, greenShift: 1, lossStops: 0.3 },
    { name: 'Warm half', miredShift: 80, greenShift: 0, lossStops: 0.5 },
  ],
};

const savedSetup = (inputs: object, resolved: object) => ({
  id: SETUP_ID,
  name: 'Orchard portraits',
  venue: 'Pear orchard gate',
  notes: null,
  date: place.date,
  timeZone: place.timeZone,
  windowStart: null,
  windowEnd: null,
  createdBy: null,
  createdAt: '2026-07-01T10:00:00Z',
  updatedAt: '2026-07-01T10:00:00Z',
  inputs,
  resolvedInputs: resolved,
  plan: {},
});

let calls: RecordedCall[];
let gear: typeof fullGear;
let opened: ReturnType<typeof savedSetup>;

beforeEach(() => {
  gear = fullGear;
  opened = savedSetup(linkedInputs, resolvedInputs);
  calls = recordFetch((call) => {
    if (call.path === '/v1/gear/lights') return jsonResponse({ data: gear.lights });
    if (call.path === '/v1/gear/modifiers') return jsonResponse({ data: gear.modifiers });
    if (call.path === '/v1/gear/gel-kits') return jsonResponse({ data: gear.gelKits });
    if (call.path === `/v1/setups/${SETUP_ID}`) return jsonResponse(opened);
    if (call.method === 'POST' && call.path === '/v1/setups')
      return jsonResponse({ ...opened, id: id(9), name: 'Orchard again' }, 201);
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
});

async function reopen() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <SessionContext.Provider value={{ ...demoSession, role: 'photographer' }}>
        <MemoryRouter initialEntries={[`/playground?setup=${SETUP_ID}&calc=setup`]}>
          <Playground />
        </MemoryRouter>
      </SessionContext.Provider>
    </QueryClientProvider>,
  );
  const panel = await screen.findByRole('tabpanel');
  await within(panel).findByText(/Opened saved setup Orchard portraits/);
  const group = (name: string) => within(panel).getByRole('group', { name });
  const key = group('Key light');
  await waitFor(() => expect(valueOf(within(key).getByLabelText('Guide number'))).toBe('58'));
  return { panel, camera: group('Camera'), key, rim: group('Rim light') };
}

const valueOf = (element: HTMLElement) => (element as HTMLInputElement).value;

describe('Dusk setup: reopening a saved setup', () => {
  it('keeps a saved rim beam that is not one of the usual ones', async () => {
    const { rim } = await reopen();
    expect(valueOf(within(rim).getByLabelText('Beam'))).toBe('25');
    // And plans with it: the API check of the preview asks with 25°, not a rounded 20° or 30°.
    await waitFor(
      () => {
        const asked = calls.filter((c) => c.method === 'POST' && c.path === '/v1/setup').at(-1);
        expect((asked?.body as { rim?: { beamAngleDeg?: number } })?.rim?.beamAngleDeg).toBe(25);
      },
      { timeout: 4000 },
    );
  });
});

describe('Dusk setup: reopening a rim saved without a beam', () => {
  it('shows it bare, as it was planned, not the new form’s 30° grid', async () => {
    const { beamAngleDeg: _beam, ...rimWithout } = resolvedInputs.rim;
    const noBeam = { ...resolvedInputs, rim: rimWithout };
    opened = savedSetup(noBeam, noBeam);
    const { rim } = await reopen();
    // The shared library plans a rim without a beam as bare: 100° (flash/backlight.ts, BARE_BEAM_DEG).
    expect(valueOf(within(rim).getByLabelText('Beam'))).toBe('100');
  });
});

/** Saves the form as it stands and returns the inputs the POST /v1/setups body carried. */
async function saveAgain(panel: HTMLElement) {
  const save = within(panel).getByRole('button', { name: 'Save setup' });
  await waitFor(() => expect((save as HTMLButtonElement).disabled).toBe(false));
  fireEvent.click(save);
  const dialog = await screen.findByRole('dialog');
  fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Orchard again' } });
  fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
  await waitFor(() =>
    expect(calls.some((c) => c.method === 'POST' && c.path === '/v1/setups')).toBe(true),
  );
  const post = calls.find((c) => c.method === 'POST' && c.path === '/v1/setups')!;
  return (post.body as { inputs: Record<string, Record<string, unknown> | undefined> }).inputs;
}

describe('Dusk setup: reopening a setup saved with studio gear', () => {
  it('picks the gear again, holds the saved values, and saves the ids again', async () => {
    const { panel, camera, key, rim } = await reopen();
    expect(valueOf(within(key).getByLabelText('Key light from your gear'))).toBe(pack.id);
    expect(valueOf(within(key).getByLabelText('Key modifier from your gear'))).toBe(octa.id);
    expect(valueOf(within(rim).getByLabelText('Rim light from your gear'))).toBe(light.id);
    expect(valueOf(within(rim).getByLabelText('Rim modifier from your gear'))).toBe(grid.id);
    expect(valueOf(within(camera).getByLabelText('Gel kit from your gear'))).toBe(kit.id);
    expect(within(camera).getByTestId('gel-kit-choice').textContent).toMatch(
      /^Gels from Warm pouch \(2\)\./,
    );
    // The boxes hold the saved values: the key's in metres, as saved.
    expect(valueOf(within(key).getByLabelText('Modifier'))).toBe('octabox');
    expect(valueOf(within(key).getByLabelText('Modifier loss (stops)'))).toBe('2.2');
    expect(valueOf(within(key).getByLabelText('Modifier size (m)'))).toBe('1.2192');
    // One guide-number unit for both lights: the rim's 36 ft is 36 x 0.3048 = 10.9728 m -> 10.97
    // (1 ft = 0.3048 m exactly, international yard and pound, 1959).
    expect(valueOf(within(rim).getByLabelText('Guide number'))).toBe('10.97');
    expect(valueOf(within(rim).getByLabelText('Modifier loss (stops)'))).toBe('0.7');
    // The kit stands for the saved gels: they are not listed again as values without a field.
    expect(within(panel).queryByText(/gel list/)).toBeNull();
    expect(within(panel).queryByTestId('gear-missing')).toBeNull();

    const inputs = await saveAgain(panel);
    expect(inputs.gelKitId).toBe(kit.id);
    expect(inputs).not.toHaveProperty('gels');
    expect(inputs.key).toMatchObject({ lightId: pack.id, modifierId: octa.id, distance: 3 });
    for (const field of ['guideNumber', 'guideNumberUnit', 'modifierLossStops', 'modifierSize'])
      expect(inputs.key).not.toHaveProperty(field);
    expect(inputs.rim).toMatchObject({ lightId: light.id, modifierId: grid.id });
    for (const field of ['guideNumber', 'modifierLossStops', 'beamAngleDeg'])
      expect(inputs.rim).not.toHaveProperty(field);
  });

  it('says which gear is gone, keeps its values, and saves them without the link', async () => {
    gear = { ...fullGear, lights: [light], gelKits: [] }; // the key light and the kit were deleted
    const { panel, camera, key, rim } = await reopen();
    expect(within(panel).getByTestId('gear-missing').textContent).toContain(
      'The key light and the gel kit this setup was saved with are no longer in your studio’s gear.',
    );
    expect(valueOf(within(key).getByLabelText('Key light from your gear'))).toBe('');
    expect(valueOf(within(key).getByLabelText('Guide number'))).toBe('58');
    expect(valueOf(within(key).getByLabelText('Guide numbers in'))).toBe('m');
    expect(within(camera).queryByLabelText('Gel kit from your gear')).toBeNull();
    // The saved gels are still planned with, listed with the other values without a field.
    expect(within(panel).getByText(/gel list \(2 pieces\)/)).toBeTruthy();
    // The gear still there comes back.
    expect(valueOf(within(rim).getByLabelText('Rim light from your gear'))).toBe(light.id);

    const inputs = await saveAgain(panel);
    expect(inputs.key).toMatchObject({
      guideNumber: 58,
      guideNumberUnit: 'm',
      modifierId: octa.id,
    });
    expect(inputs.key).not.toHaveProperty('lightId');
    expect(inputs).not.toHaveProperty('gelKitId');
    expect(inputs.gels).toEqual(resolvedInputs.gels);
    expect(inputs.rim).toMatchObject({ lightId: light.id });
  });

  it('does not pick again gear that changed since, and keeps the saved values', async () => {
    // The pack was re-rated after the setup was saved: linking it again would change the plan.
    gear = { ...fullGear, lights: [light, { ...pack, guideNumber: 64 }] };
    const { panel, key } = await reopen();
    expect(within(panel).getByTestId('gear-changed').textContent).toContain(
      'The key light Big pack has changed since this setup was saved.',
    );
    expect(valueOf(within(key).getByLabelText('Key light from your gear'))).toBe('');
    expect(valueOf(within(key).getByLabelText('Guide number'))).toBe('58');
    const inputs = await saveAgain(panel);
    expect(inputs.key).toMatchObject({ guideNumber: 58, modifierId: octa.id });
    expect(inputs.key).not.toHaveProperty('lightId');
  });
});
