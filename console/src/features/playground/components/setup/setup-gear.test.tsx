import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { beforeEach, describe, expect, it } from 'vitest';
import { SessionContext } from '@/lib/session';
import { demoSession, recordFetch, type RecordedCall } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { Playground } from '../playground';

// Invented studio gear (names of our own, no products).
const id = (n: number) => `b2c0d4e6-0000-4000-8000-00000000000${n}`;
const gear = {
  lights: [
    { id: id(1), name: 'Garden strobe', guideNumber: 36, guideNumberUnit: 'ft' },
    { id: id(2), name: 'Big pack', guideNumber: 58, guideNumberUnit: 'm' },
  ],
  modifiers: [
    // Sized in feet: the form (in metres) shows it converted.
    { id: id(3), name: 'Wide octa', kind: 'octabox', lossStops: 2.2, size: 4, sizeUnit: 'ft' },
    {
      id: id(4),
      name: 'Tight grid',
      kind: 'grid',
      lossStops: 0.7,
      beamAngleDeg: 25,
      size: null,
      sizeUnit: null,
    },
  ],
  gelKits: [
    { id: id(5), name: 'Empty pouch', notes: null, pieces: [] },
    {
      id: id(6),
      name: 'Warm pouch',
      notes: null,
      // Listed out of order: the kit's order is `position`.
      pieces: [
        {
          id: id(7),
          name: 'Warm half',
          miredShift: 80,
          greenShift: 0,
          lossStops: 0.5,
          position: 1,
        },
        {
          id: id(8),
          name: 'Warm quarter',
          miredShift: 40,
          greenShift: 1,
          lossStops: 0.3,
          position: 0,
        },
      ],
    },
  ],
};

let calls: RecordedCall[];

beforeEach(() => {
  calls = recordFetch((call) => {
    if (call.path === '/v1/gear/lights') return jsonResponse({ data: gear.lights });
    if (call.path === '/v1/gear/modifiers') return jsonResponse({ data: gear.modifiers });
    if (call.path === '/v1/gear/gel-kits') return jsonResponse({ data: gear.gelKits });
    if (call.method === 'POST' && call.path === '/v1/setups')
      return jsonResponse({ id: id(9), name: 'Garden', date: '2026-06-20' }, 201);
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
});

async function openSetup() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <SessionContext.Provider value={{ ...demoSession, role: 'photographer' }}>
        <MemoryRouter initialEntries={['/playground?calc=setup']}>
          <Playground />
        </MemoryRouter>
      </SessionContext.Provider>
    </QueryClientProvider>,
  );
  const panel = await screen.findByRole('tabpanel');
  const group = (name: string) => within(panel).getByRole('group', { name });
  return { panel, camera: group('Camera'), key: group('Key light'), rim: group('Rim light') };
}

const valueOf = (element: HTMLElement) => (element as HTMLInputElement).value;
const pick = async (scope: ReturnType<typeof within>, label: string, value: string) =>
  fireEvent.change(await scope.findByLabelText(label), { target: { value } });

/** The body of the latest POST /v1/setup (the API check of the preview). */
type SetupBody = { key: Record<string, unknown>; rim: Record<string, unknown>; gels?: unknown };
const lastAsked = () =>
  calls.filter((c) => c.method === 'POST' && c.path === '/v1/setup').at(-1)?.body as
    SetupBody | undefined;

describe('Dusk setup: gear pickers', () => {
  it('fills the key light and its modifier from the gear and asks the API with their numbers', async () => {
    const { key, rim } = await openSetup();
    await pick(within(key), 'Key light from your gear', id(1));
    expect(valueOf(within(key).getByLabelText('Guide number'))).toBe('36');
    expect(valueOf(within(key).getByLabelText('Guide numbers in'))).toBe('ft');
    // One unit for both lights: the rim's 40 m becomes feet. 1 ft = 0.3048 m exactly
    // (international yard and pound, 1959): 40 / 0.3048 = 131.2336 -> 131.23.
    expect(valueOf(within(rim).getByLabelText('Guide number'))).toBe('131.23');
    await pick(within(key), 'Key modifier from your gear', id(3));
    expect(valueOf(within(key).getByLabelText('Modifier'))).toBe('octabox');
    expect(valueOf(within(key).getByLabelText('Modifier loss (stops)'))).toBe('2.2');
    // 4 ft x 0.3048 = 1.2192 m, shown to 2 decimals like the unit toggle.
    expect(valueOf(within(key).getByLabelText('Modifier size (m)'))).toBe('1.22');
    await waitFor(
      () =>
        expect(lastAsked()).toMatchObject({
          key: {
            guideNumber: 36,
            guideNumberUnit: 'ft',
            modifier: 'octabox',
            modifierLossStops: 2.2,
            modifierSize: 1.22,
          },
          rim: { guideNumber: 131.23, guideNumberUnit: 'ft' },
        }),
      { timeout: 4000 },
    );
  });

  it('fills the rim light and its modifier, beam included, and asks the API with them', async () => {
    const { rim } = await openSetup();
    // A light rated in feet, on a form in metres: 36 x 0.3048 = 10.9728 -> 10.97.
    await pick(within(rim), 'Rim light from your gear', id(1));
    expect(valueOf(within(rim).getByLabelText('Guide number'))).toBe('10.97');
    await pick(within(rim), 'Rim modifier from your gear', id(4));
    expect(valueOf(within(rim).getByLabelText('Modifier loss (stops)'))).toBe('0.7');
    // 25° is not one of the usual beams: the select offers it rather than rounding it away.
    expect(valueOf(within(rim).getByLabelText('Beam'))).toBe('25');
    await waitFor(
      () =>
        expect(lastAsked()?.rim).toMatchObject({
          guideNumber: 10.97,
          guideNumberUnit: 'm',
          modifierLossStops: 0.7,
          beamAngleDeg: 25,
        }),
      { timeout: 4000 },
    );
  });

  it('plans with a gel kit’s pieces, in the kit’s order, until the built-in gels are asked for', async () => {
    const { camera } = await openSetup();
    const kitPicker = await within(camera).findByLabelText('Gel kit from your gear');
    const offered = [...(kitPicker as HTMLSelectElement).options].map((o) => o.value);
    expect(offered).toEqual(['', id(6)]); // the empty kit has nothing to choose from
    fireEvent.change(kitPicker, { target: { value: id(6) } });
    expect(within(camera).getByTestId('gel-kit-choice').textContent).toMatch(
      /^Gels from Warm pouch \(2\)\./,
    );
    await waitFor(
      () =>
        expect(lastAsked()?.gels).toEqual([
          { name: 'Warm quarter', miredShift: 40, greenShift: 1, lossStops: 0.3 },
          { name: 'Warm half', miredShift: 80, greenShift: 0, lossStops: 0.5 },
        ]),
      { timeout: 4000 },
    );
    fireEvent.click(within(camera).getByRole('button', { name: 'Use the built-in gels' }));
    await waitFor(() => expect(lastAsked()).not.toHaveProperty('gels'), { timeout: 4000 });
  });

  it('saves picked gear by id, and a value changed after picking as typed', async () => {
    const { panel, camera, key, rim } = await openSetup();
    await pick(within(key), 'Key light from your gear', id(2));
    await pick(within(key), 'Key modifier from your gear', id(3));
    await pick(within(rim), 'Rim light from your gear', id(2));
    await pick(within(rim), 'Rim modifier from your gear', id(4));
    await pick(within(camera), 'Gel kit from your gear', id(6));
    // The rim's guide number is changed by hand: it no longer stands for the light.
    fireEvent.change(within(rim).getByLabelText('Guide number'), { target: { value: '50' } });
    await waitFor(() => expect(lastAsked()?.rim).toMatchObject({ guideNumber: 50 }), {
      timeout: 4000,
    });
    fireEvent.click(within(panel).getByRole('button', { name: 'Save setup' }));
    const dialog = await screen.findByRole('dialog');
    fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Garden' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
    await waitFor(() =>
      expect(calls.some((c) => c.method === 'POST' && c.path === '/v1/setups')).toBe(true),
    );
    const saved = calls.find((c) => c.method === 'POST' && c.path === '/v1/setups')!.body as {
      inputs: SetupBody & { gelKitId?: string };
    };
    const { inputs } = saved;
    expect(inputs.gelKitId).toBe(id(6));
    expect(inputs).not.toHaveProperty('gels');
    expect(inputs.key).toMatchObject({ lightId: id(2), modifierId: id(3), modifier: 'octabox' });
    for (const field of ['guideNumber', 'guideNumberUnit', 'modifierLossStops', 'modifierSize'])
      expect(inputs.key).not.toHaveProperty(field);
    expect(inputs.rim).toMatchObject({ guideNumber: 50, guideNumberUnit: 'm', modifierId: id(4) });
    for (const field of ['lightId', 'modifierLossStops', 'beamAngleDeg'])
      expect(inputs.rim).not.toHaveProperty(field);
  });
});
