import {
  MODIFIERS,
  computeBacklight,
  computeFlash,
  computeTwilight,
  solveBalance,
} from '@lumenwright/shared';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse } from '@/test/responses';
import { clockTime, fixed } from '../utils/format';
import { Playground } from './playground';

type Responder = (path: string, body: unknown) => Response;
let respond: Responder;

beforeEach(() => {
  respond = () =>
    jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      // The typed client passes a Request; the plain fetch helper a URL string.
      const path = new URL(input instanceof Request ? input.url : String(input)).pathname;
      if (path === '/v1/health')
        return jsonResponse({ status: 'ok', info: { database: { status: 'up' } } });
      return respond(path, init?.body ? JSON.parse(String(init.body)) : undefined);
    }),
  );
});

async function openCalculation(calc: string) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter initialEntries={[`/playground?calc=${calc}`]}>
        <Playground />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  const panel = await screen.findByRole('tabpanel');
  return panel;
}

function setValue(field: HTMLElement, value: string) {
  fireEvent.change(field, { target: { value } });
}

describe('playground', () => {
  it('opens the tab named in ?calc= and lists every calculation as a tab', async () => {
    await openCalculation('falloff');
    const tabs = screen.getAllByRole('tab');
    expect(tabs.map((tab) => tab.textContent)).toEqual([
      'Twilight',
      'Evening plan',
      'Background',
      'Flash',
      'Falloff',
      'Backlight',
      'Gels',
      'Dusk setup',
    ]);
    expect(screen.getByRole('tab', { selected: true }).textContent).toBe('Falloff');
  });

  // The browser test (e2e/accessibility.e2e.ts) presses Tab from the tab to the first field.
  it('keeps the panels out of the Tab order; their fields stay in it', async () => {
    const panel = await openCalculation('flash');
    // Headless UI makes the open panel a Tab stop (tabindex 0) unless told otherwise.
    expect(panel.getAttribute('tabindex')).toBe('-1');
    for (const hidden of document.querySelectorAll('[role="tabpanel"]')) {
      expect(hidden.getAttribute('tabindex')).toBe('-1');
    }
    const field = panel.querySelector('input, select')!;
    expect(field.getAttribute('tabindex')).toBeNull();
  });

  it('draws the twilight timeline for the typed place and date, matching shared/', async () => {
    const panel = await openCalculation('twilight');
    setValue(within(panel).getByLabelText('Date'), '2026-06-21');
    setValue(within(panel).getByLabelText('Latitude (°N)'), '60');
    const expected = computeTwilight({
      latitude: 60,
      longitude: 8,
      date: '2026-06-21',
      timeZone: 'Europe/Zurich',
      sky: 'clear',
    });
    await waitFor(() => {
      const sunset = within(panel).getByText('Sunset').nextElementSibling;
      expect(sunset?.textContent).toBe(clockTime(expected.sunset));
    });
    const chart = panel.querySelector('svg[data-chart="twilight"]');
    expect(chart).not.toBeNull();
    expect(chart!.querySelector('[data-series="altitude"]')?.getAttribute('d')).toMatch(
      /^M[\d.]+,[\d.]+L/,
    );
    expect(chart!.querySelector('[data-band="civil"]')).not.toBeNull();
    // Moving the shooting minute moves the marker and the readout.
    const slider = within(panel).getByRole('slider');
    setValue(slider, '10');
    expect(chart!.querySelector('[data-selected]')?.getAttribute('data-selected')).toBe(
      expected.ambient.points[10]!.time,
    );
    expect(within(panel).getByTestId('chosen-minute').textContent).toContain(
      `At ${clockTime(expected.ambient.points[10]!.time)}`,
    );
  });

  it('shows the shared function’s complaint, naming the field, for input out of range', async () => {
    const panel = await openCalculation('twilight');
    setValue(within(panel).getByLabelText('Latitude (°N)'), '95');
    const alert = await within(panel).findByRole('alert');
    expect(alert.textContent).toBe('Latitude: must be between -90 and 90');
  });

  it('converts typed distances when switching to feet, remembers the choice, and sends ft', async () => {
    const panel = await openCalculation('flash');
    const distance = within(panel).getByLabelText('Light to subject (m)') as HTMLInputElement;
    expect(distance.value).toBe('2');
    fireEvent.click(screen.getByRole('radio', { name: 'ft (feet)' }));
    await waitFor(() =>
      expect(
        (within(panel).getByLabelText('Light to subject (ft)') as HTMLInputElement).value,
      ).toBe('6.56'),
    );
    expect(window.localStorage.getItem('lumenwright.length-unit')).toBe('ft');
    fireEvent.click(within(panel).getByRole('button', { name: 'Copy as curl' }));
    const curl = await within(panel).findByLabelText('curl command');
    expect(curl.textContent).toContain('"distanceUnit": "ft"');
    expect(curl.textContent).toContain('"distance": 6.56');
  });

  it('copies a curl command whose body is the exact input of the preview', async () => {
    const panel = await openCalculation('flash');
    fireEvent.click(within(panel).getByRole('button', { name: 'Copy as curl' }));
    const curl = (await within(panel).findByLabelText('curl command')).textContent ?? '';
    expect(curl).toContain(`'${window.location.origin}/v1/flash'`);
    const json = curl.slice(curl.indexOf("--data '") + 8, curl.lastIndexOf("'"));
    expect(JSON.parse(json)).toEqual({
      guideNumber: 40,
      guideNumberUnit: 'm',
      distance: 2,
      distanceUnit: 'm',
      aperture: 5.6,
      modifierLossStops: 1.25,
      iso: 400,
      gelLossStops: 0.4,
    });
    fireEvent.click(within(panel).getByRole('button', { name: 'Copy as SDK call' }));
    const sdk = (await within(panel).findByLabelText('SDK call')).textContent ?? '';
    expect(sdk).toContain('await lw.flash({');
  });

  it('says the API agrees when the server returns what the preview computed', async () => {
    respond = (path, body) =>
      path === '/v1/flash' ? jsonResponse(computeFlash(body as never)) : jsonResponse({}, 404);
    const panel = await openCalculation('flash');
    const status = await within(panel).findByText(
      'The API agrees with this result',
      {},
      { timeout: 4000 },
    );
    expect(status.getAttribute('data-confirmation')).toBe('agrees');
  });

  it('asks the API only about the tab on screen, and about another once it is opened', async () => {
    const asked: string[] = [];
    respond = (path, body) => {
      asked.push(path);
      return path === '/v1/flash'
        ? jsonResponse(computeFlash(body as never))
        : jsonResponse({}, 404);
    };
    await openCalculation('flash');
    await screen.findByText('The API agrees with this result', {}, { timeout: 4000 });
    // Hidden tabs keep their inputs but ask nothing (they used to ask on every change). The
    // flash tab also reads the studio's gear for its pickers.
    const calculations = () => asked.filter((p) => !p.startsWith('/v1/gear/'));
    expect(new Set(calculations())).toEqual(new Set(['/v1/flash']));
    fireEvent.click(screen.getByRole('tab', { name: 'Falloff' }));
    await waitFor(() => expect(asked).toContain('/v1/falloff'), { timeout: 4000 });
    expect(calculations().filter((p) => p !== '/v1/flash' && p !== '/v1/falloff')).toEqual([]);
  });

  it("fills the flash's guide number and modifier from the studio's gear", async () => {
    const light = { id: 'a1f0c3de-0000-4000-8000-000000000001', name: 'Porch strobe' };
    const soft = { id: 'a1f0c3de-0000-4000-8000-000000000002', name: 'Shoot-through' };
    const sent: { guideNumber?: number; guideNumberUnit?: string; modifierLossStops?: number }[] =
      [];
    respond = (path, body) => {
      if (path === '/v1/gear/lights')
        return jsonResponse({ data: [{ ...light, guideNumber: 36, guideNumberUnit: 'ft' }] });
      if (path === '/v1/gear/modifiers')
        return jsonResponse({ data: [{ ...soft, kind: 'umbrella', lossStops: 1.2 }] });
      if (path === '/v1/flash') {
        sent.push(body as (typeof sent)[number]);
        return jsonResponse(computeFlash(body as never));
      }
      return jsonResponse({}, 404);
    };
    const panel = await openCalculation('flash');
    const lightPicker = await within(panel).findByLabelText('Light from your gear');
    fireEvent.change(lightPicker, { target: { value: light.id } });
    expect((within(panel).getByLabelText('Guide number (ISO 100)') as HTMLInputElement).value).toBe(
      '36',
    );
    expect((within(panel).getByLabelText('Guide number in') as HTMLSelectElement).value).toBe('ft');
    fireEvent.change(within(panel).getByLabelText('Modifier from your gear'), {
      target: { value: soft.id },
    });
    expect((within(panel).getByLabelText('Modifier') as HTMLSelectElement).value).toBe('umbrella');
    expect((within(panel).getByLabelText('Modifier loss (stops)') as HTMLInputElement).value).toBe(
      '1.2',
    );
    // The API is asked with the gear's numbers.
    await waitFor(
      () =>
        expect(sent.at(-1)).toMatchObject({
          guideNumber: 36,
          guideNumberUnit: 'ft',
          modifierLossStops: 1.2,
        }),
      { timeout: 4000 },
    );
  });

  it('shows the modifier’s usual loss in an empty loss box, alike on the Flash and Dusk setup tabs', async () => {
    // The usual losses are the shared library's modifier table (shared/src/flash: MODIFIERS).
    for (const [calc, group] of [
      ['flash', 'Key light'],
      ['setup', 'Key light'],
    ] as const) {
      const panel = await openCalculation(calc);
      const fields = within(within(panel).getByRole('group', { name: group }));
      const loss = fields.getByLabelText('Modifier loss (stops)');
      for (const modifier of ['softbox', 'octabox'] as const) {
        setValue(fields.getByLabelText('Modifier'), modifier);
        setValue(loss, '');
        await waitFor(() =>
          expect(loss.getAttribute('placeholder')).toBe(`default ${MODIFIERS[modifier].lossStops}`),
        );
      }
      expect(fields.getAllByText("Empty: the modifier's usual").length).toBeGreaterThan(0);
      cleanup();
    }
  });

  it('names the fields where the API answer differs, and explains a missing endpoint', async () => {
    respond = (path, body) => jsonResponse({ ...computeFlash(body as never), powerLabel: '1/2' });
    const panel = await openCalculation('flash');
    const status = await within(panel).findByText(/answered differently/, {}, { timeout: 4000 });
    expect(status.textContent).toBe('The API answered differently (powerLabel)');
  });

  it('says so when a calculation is not on the API yet', async () => {
    const panel = await openCalculation('falloff');
    expect(
      await within(panel).findByText(
        'This calculation is not on the API yet',
        {},
        { timeout: 4000 },
      ),
    ).toBeTruthy();
  });

  it('lists fixes when the flash cannot reach, and adds road cautions when the site is by a road', async () => {
    const panel = await openCalculation('flash');
    setValue(within(panel).getByLabelText('Light to subject (m)'), '30');
    expect(await within(panel).findByText('Any one of these fixes it:')).toBeTruthy();
    const before = panel.querySelectorAll('[data-caution]').length;
    expect(panel.querySelector('[data-caution="stands-wind"]')).not.toBeNull();
    expect(panel.querySelector('[data-caution="roads-at-night"]')).toBeNull();
    fireEvent.click(screen.getByLabelText('Near a road'));
    await waitFor(() =>
      expect(panel.querySelector('[data-caution="roads-at-night"]')).not.toBeNull(),
    );
    expect(panel.querySelectorAll('[data-caution]').length).toBe(before + 1);
  });

  it('below the lowest power, lists each fix the API gives, ISO and ND or diffusion too', async () => {
    respond = (path, body) =>
      path === '/v1/flash' ? jsonResponse(computeFlash(body as never)) : jsonResponse({}, 404);
    const panel = await openCalculation('flash');
    // Close enough to need less than the lowest power, not so close that the ISO it would take
    // falls under any camera's lowest (then no ISO fix is offered).
    setValue(within(panel).getByLabelText('Light to subject (m)'), '0.4');
    expect(await within(panel).findByText('Any one of these fixes it:')).toBeTruthy();
    const items = within(panel)
      .getAllByRole('listitem')
      .map((li) => li.textContent ?? '');
    expect(items.some((t) => /^Move the light back to /.test(t))).toBe(true);
    expect(items.some((t) => /^Lower ISO to \d+$/.test(t))).toBe(true);
    expect(
      items.some((t) =>
        /^Take [\d.]+ stops away in front of the flash \(ND gel or more diffusion\)$/.test(t),
      ),
    ).toBe(true);
  });

  it('plans the whole dusk setup with both diagrams, suggested minutes and cautions', async () => {
    const panel = await openCalculation('setup');
    const plan = await within(panel).findByTestId('setup-plan', {}, { timeout: 4000 });
    expect(plan.querySelector('svg[data-diagram="top"]')).not.toBeNull();
    const side = plan.querySelector('svg[data-diagram="side"]');
    expect(side?.querySelector('[data-light="rim"]')).not.toBeNull();
    expect(side?.querySelector('[data-light="key"]')).not.toBeNull();
    expect(within(plan).getAllByRole('row').length).toBeGreaterThan(1);
    expect(plan.querySelector('[data-caution="batteries"]')).not.toBeNull();
    expect(plan.querySelectorAll('[data-swatch]').length).toBeGreaterThan(3);
  });

  it('gives the Dusk setup tab a new time zone or sky even when the chosen instant stays the same', async () => {
    const panel = await openCalculation('setup');
    const place = () =>
      within(panel).getByText(/^Place and date from the Twilight tab/).textContent;
    await waitFor(() => expect(place()).toMatch(/\(Europe\/Zurich\), sky clear\./));
    // Same UTC offset as Zurich all year: the instants (and so the chosen minute) do not move.
    // The Twilight tab's fields (mounted, hidden; the Evening plan tab has a time zone too).
    const twilightTab = screen.getByRole('tab', { name: 'Twilight' });
    const twilight = document.getElementById(twilightTab.getAttribute('aria-controls') ?? '')!;
    setValue(within(twilight).getByLabelText('Time zone'), 'Europe/Rome');
    await waitFor(() => expect(place()).toMatch(/\(Europe\/Rome\), sky clear\./));
    setValue(within(twilight).getByLabelText('Sky'), 'overcast');
    await waitFor(() => expect(place()).toMatch(/\(Europe\/Rome\), sky overcast\./));
  });

  it('exposes the background for the minute chosen on the Twilight tab, or for a meter reading', async () => {
    const panel = await openCalculation('exposure');
    const source = within(panel).getByLabelText('Light level from') as HTMLSelectElement;
    // The twilight tab (mounted, hidden) publishes its default minute.
    await waitFor(() =>
      expect(source.options[0]!.textContent).toMatch(/^Twilight tab: \d{2}:\d{2} \(EV100 /),
    );
    const evFromTwilight = /EV100 (−?[\d.]+)/.exec(source.options[0]!.textContent ?? '')![1];
    const readout = () => within(panel).getByText('Ambient EV100').nextElementSibling?.textContent;
    expect(readout()).toBe(evFromTwilight);
    setValue(source, 'metered');
    setValue(await within(panel).findByLabelText('Metered EV100 (incident)'), '9');
    await waitFor(() => expect(readout()).toBe('9.0'));
    expect(panel.querySelector('svg[data-chart="shutter"]')).not.toBeNull();
  });

  it('shows the gel stack and scene swatches solveBalance picks for the camera white balance', async () => {
    const panel = await openCalculation('balance');
    setValue(within(panel).getByLabelText('Camera WB (K)'), '3000');
    const stackFor = (miredTolerance: number) =>
      solveBalance({ cameraKelvin: 3000, flashKelvin: 5500, maxGels: 3, miredTolerance });
    const expected = stackFor(10); // the playground accepts 10 mired by default
    await waitFor(() =>
      expect(within(panel).getByTestId('gel-stack').textContent).toBe(
        expected.gels.map((gel) => gel.name).join('') || 'No gel needed',
      ),
    );
    expect(panel.querySelectorAll('[data-swatch]').length).toBe(expected.scene.length);
    expect(panel.querySelector('svg[data-chart="mired"]')).not.toBeNull();
    // 0 asks for the closest stack, which at 3000 K is a longer one.
    setValue(within(panel).getByLabelText('Close enough (mired)'), '0');
    const closest = stackFor(0);
    expect(closest.gels.length).toBeGreaterThan(expected.gels.length);
    await waitFor(() =>
      expect(within(panel).getByTestId('gel-stack').textContent).toBe(
        closest.gels.map((gel) => gel.name).join(''),
      ),
    );
  });

  it('draws the rim beam and marks ground spill when the light is aimed down', async () => {
    const panel = await openCalculation('backlight');
    setValue(within(panel).getByLabelText('Height (m)'), '2.5');
    setValue(within(panel).getByLabelText('Tilt (°, + up)'), '-20');
    const expected = computeBacklight({
      lightHeight: 2.5,
      distanceBehind: 2.5,
      headHeight: 1.6,
      distanceUnit: 'm',
      beamAngleDeg: 30,
      tiltDeg: -20,
    });
    expect(expected.groundSpill).not.toBeNull();
    await waitFor(() =>
      expect(panel.querySelector('svg[data-diagram="side"] [data-spill]')).not.toBeNull(),
    );
    expect(panel.querySelector('svg[data-diagram="side"] [data-beam]')).not.toBeNull();
    expect(within(panel).getByText('Aim').nextElementSibling?.textContent).toBe(
      `${fixed(expected.aimDeg)}°`,
    );
  });
});
