import { computeFlash, computeTwilight } from '@lumenwright/shared';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderApp } from '@/test/render';
import { clockTime } from '../utils/format';

type Responder = (path: string, body: unknown) => Response;
let respond: Responder;

beforeEach(() => {
  respond = () =>
    jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input)).pathname;
      if (path === '/v1/health')
        return jsonResponse({ status: 'ok', info: { database: { status: 'up' } } });
      return respond(path, init?.body ? JSON.parse(String(init.body)) : undefined);
    }),
  );
});

async function openCalculation(calc: string) {
  renderApp(`/playground?calc=${calc}`);
  const panel = await screen.findByRole('tabpanel', {}, { timeout: 5000 });
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
      'Background',
      'Flash',
      'Falloff',
      'Backlight',
      'Gels',
      'Dusk setup',
    ]);
    expect(screen.getByRole('tab', { selected: true }).textContent).toBe('Falloff');
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
    expect(alert.textContent).toBe('Latitude: must be >= -90 and <= 90');
  });

  it('converts typed distances when switching to feet, remembers the choice, and sends ft', async () => {
    const panel = await openCalculation('flash');
    const distance = within(panel).getByLabelText('Light to subject (m)') as HTMLInputElement;
    expect(distance.value).toBe('2');
    fireEvent.click(screen.getByRole('radio', { name: 'Feet' }));
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
    expect(sdk).toContain('client.POST("/v1/flash"');
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
});
