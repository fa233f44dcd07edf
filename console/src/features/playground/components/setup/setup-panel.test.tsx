import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { beforeEach, describe, expect, it } from 'vitest';
import { SessionContext, type Session } from '@/lib/session';
import { demoSession, recordFetch, type RecordedCall } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { planDuskSetup } from '@lumenwright/shared';
import { Playground } from '../playground';

const SETUP_ID = '3f1c2a9e-7b4d-4e2a-9c1f-5a6b7c8d9e01';

/** An invented saved setup: a lakeside terrace at an invented venue. */
const savedInputs = {
  latitude: 47.1,
  longitude: 8.2,
  date: '2026-06-20',
  timeZone: 'Europe/Zurich',
  sky: 'partly-cloudy',
  camera: { aperture: 4, isoMax: 3200, support: 'tripod', flashSyncSeconds: 0.004, kelvin: 4000 },
  key: {
    guideNumber: 45,
    guideNumberUnit: 'm',
    distance: 3,
    distanceUnit: 'm',
    angleFromCameraDeg: 50,
    modifier: 'bare',
  },
  rim: {
    guideNumber: 36,
    guideNumberUnit: 'm',
    distanceBehind: 10,
    lightHeight: 5,
    distanceUnit: 'ft',
    beamAngleDeg: 20,
    rimOverKeyStops: 0.5,
    gelled: false,
  },
  backgroundDistance: 15,
  conditions: { nearWater: true },
};

const savedSetup = {
  id: SETUP_ID,
  name: 'Boathouse couple',
  venue: 'Quillmere boathouse terrace',
  notes: null,
  date: '2026-06-20',
  timeZone: 'Europe/Zurich',
  windowStart: null,
  windowEnd: null,
  createdBy: null,
  createdAt: '2026-05-01T10:00:00Z',
  updatedAt: '2026-05-01T10:00:00Z',
  inputs: savedInputs,
  resolvedInputs: savedInputs,
  plan: {},
};

type Call = RecordedCall;
type Responder = (call: Call) => Response;
let respond: Responder;
let calls: Call[];

beforeEach(() => {
  respond = ({ path }) =>
    path === `/v1/setups/${SETUP_ID}`
      ? jsonResponse(savedSetup)
      : jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  calls = recordFetch((call) => {
    if (call.path === '/v1/health')
      return jsonResponse({ status: 'ok', info: { database: { status: 'up' } } });
    return respond(call);
  });
});

function openPlayground(search: string, role: Session['role'] = 'photographer') {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <SessionContext.Provider value={{ ...demoSession, role }}>
        <MemoryRouter initialEntries={[`/playground${search}`]}>
          <Playground />
        </MemoryRouter>
      </SessionContext.Provider>
    </QueryClientProvider>,
  );
  return screen.findByRole('tabpanel');
}

const valueOf = (element: HTMLElement) => (element as HTMLInputElement).value;

async function openSaved() {
  const panel = await openPlayground(`?setup=${SETUP_ID}&calc=setup`);
  await within(panel).findByText(/Opened saved setup Boathouse couple/);
  const key = within(panel).getByRole('group', { name: 'Key light' });
  await waitFor(() => expect(valueOf(within(key).getByLabelText('Guide number'))).toBe('45'));
  return { panel, key };
}

describe('Dusk setup: saved setups', () => {
  it('fills the form from a saved setup, converting lengths to the display unit', async () => {
    const { panel, key } = await openSaved();
    expect(
      within(panel).getByText(
        'Opened saved setup Boathouse couple (Quillmere boathouse terrace, 2026-06-20).',
        { exact: false },
      ),
    ).toBeTruthy();
    expect(within(panel).getByRole('link', { name: 'Back to setups' }).getAttribute('href')).toBe(
      '/setups',
    );
    expect(calls.some((c) => c.method === 'GET' && c.path === `/v1/setups/${SETUP_ID}`)).toBe(true);
    expect(valueOf(within(key).getByLabelText('Distance (m)'))).toBe('3');
    expect(valueOf(within(key).getByLabelText('Angle from camera (°)'))).toBe('50');
    expect(valueOf(within(key).getByLabelText('Modifier'))).toBe('bare');
    expect(valueOf(within(key).getByLabelText('Key to background (m)'))).toBe('15');
    const camera = within(panel).getByRole('group', { name: 'Camera' });
    expect(valueOf(within(camera).getByLabelText('Aperture (f/)'))).toBe('4');
    // 0.004 s is 1/250 s.
    expect(valueOf(within(camera).getByLabelText('Flash sync (1/x s)'))).toBe('250');
    expect(valueOf(within(camera).getByLabelText('Support'))).toBe('tripod');
    // Saved without a gel tolerance: it was planned with the closest stack, so 0 (not the new-form 10).
    expect(valueOf(within(camera).getByLabelText('Gels close enough (mired)'))).toBe('0');
    const rim = within(panel).getByRole('group', { name: 'Rim light' });
    // 1 ft = 0.3048 m exactly (international yard and pound, 1959): 10 ft = 3.048 m, 5 ft = 1.524 m.
    expect(valueOf(within(rim).getByLabelText('Behind subject (m)'))).toBe('3.05');
    expect(valueOf(within(rim).getByLabelText('Height (m)'))).toBe('1.52');
    expect(valueOf(within(rim).getByLabelText('Beam'))).toBe('20');
    expect((within(rim).getByLabelText('Gel like the key') as HTMLInputElement).checked).toBe(
      false,
    );
    expect(within(panel).getByText(/Place and date from the saved setup: 47\.100°/)).toBeTruthy();
  });

  it('plans a reopened setup with its saved values that have no field, as its sheet does', async () => {
    // A setup saved through the API with gear values the form has no field for.
    const extras = {
      ...savedInputs,
      stepMinutes: 2,
      camera: { ...savedInputs.camera, isoMin: 200 },
      key: { ...savedInputs.key, modifier: 'softbox', modifierLossStops: 3 },
    };
    respond = ({ path }) =>
      path === `/v1/setups/${SETUP_ID}`
        ? jsonResponse({ ...savedSetup, inputs: extras, resolvedInputs: extras })
        : jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    const { panel, key } = await openSaved();
    const notice = within(panel).getByText(/Also planned with these saved values/);
    // The key modifier's loss has a field now: it shows there, not in the notice.
    expect(valueOf(within(key).getByLabelText('Modifier loss (stops)'))).toBe('3');
    expect(notice.textContent).not.toContain('modifier loss');
    expect(notice.textContent).toContain('minutes between points 2');
    expect(notice.textContent).toContain('lowest ISO 200');
    // The preview is the saved plan: the shared library on the saved (resolved) inputs.
    const asSaved = planDuskSetup(extras as never);
    const withoutExtras = planDuskSetup({
      ...savedInputs,
      key: { ...savedInputs.key, modifier: 'softbox' },
    } as never);
    expect(withoutExtras.suggestedMinutes[0]!.keyFlash.powerLabel).not.toBe(
      asSaved.suggestedMinutes[0]!.keyFlash.powerLabel,
    );
    const firstKey = () =>
      within(panel).getAllByRole('row')[1]!.querySelectorAll('td')[3]?.textContent;
    await waitFor(() => expect(firstKey()).toBe(asSaved.suggestedMinutes[0]!.keyFlash.powerLabel));
    // Another modifier drops the saved modifier's loss; the other saved values stay.
    fireEvent.change(within(key).getByLabelText('Modifier'), { target: { value: 'umbrella' } });
    expect(valueOf(within(key).getByLabelText('Modifier loss (stops)'))).toBe('');
    const umbrella = planDuskSetup({
      ...extras,
      key: { ...savedInputs.key, modifier: 'umbrella' },
    } as never);
    expect(umbrella.suggestedMinutes[0]!.keyFlash.powerLabel).not.toBe(
      asSaved.suggestedMinutes[0]!.keyFlash.powerLabel,
    );
    await waitFor(() => expect(firstKey()).toBe(umbrella.suggestedMinutes[0]!.keyFlash.powerLabel));
    // And the notice's button plans without any of them.
    fireEvent.click(within(panel).getByRole('button', { name: 'Plan without them' }));
    expect(within(panel).queryByText(/Also planned with these saved values/)).toBeNull();
    const bare = planDuskSetup({
      ...savedInputs,
      key: { ...savedInputs.key, modifier: 'umbrella' },
    } as never);
    await waitFor(() => expect(firstKey()).toBe(bare.suggestedMinutes[0]!.keyFlash.powerLabel));
  });

  it('shows what an empty box stands for, and refuses 1/0 s instead of using the default', async () => {
    const { panel } = await openSaved();
    const camera = within(panel).getByRole('group', { name: 'Camera' });
    const aperture = within(camera).getByLabelText('Aperture (f/)');
    fireEvent.change(aperture, { target: { value: '' } });
    // The shared library's own default (setup-input.ts): f/5.6 when no aperture is given.
    expect(aperture.getAttribute('placeholder')).toBe('default 5.6');
    expect(within(camera).getByLabelText('White balance (K)').getAttribute('placeholder')).toBe(
      'default 3800',
    );
    const sync = within(camera).getByLabelText('Flash sync (1/x s)');
    fireEvent.change(sync, { target: { value: '0' } });
    expect(
      await within(camera).findByText('Enter x of 1/x s above 0, e.g. 200, or leave it empty'),
    ).toBeTruthy();
    expect(sync.getAttribute('aria-invalid')).toBe('true');
  });

  it('shows the saved place and date on the Twilight tab too', async () => {
    await openSaved();
    fireEvent.click(screen.getByRole('tab', { name: /Twilight/ }));
    const twilight = screen.getByRole('tabpanel');
    await waitFor(() =>
      expect(valueOf(within(twilight).getByLabelText('Latitude (°N)'))).toBe('47.1'),
    );
    expect(valueOf(within(twilight).getByLabelText('Longitude (°E)'))).toBe('8.2');
    expect(valueOf(within(twilight).getByLabelText('Date'))).toBe('2026-06-20');
  });

  it('saves the current inputs and shows the server’s field errors inline', async () => {
    const { panel, key } = await openSaved();
    fireEvent.change(within(key).getByLabelText('Distance (m)'), { target: { value: '3.5' } });
    await waitFor(() => expect(valueOf(within(key).getByLabelText('Distance (m)'))).toBe('3.5'));
    respond = ({ method, path, body }) => {
      if (method === 'POST' && path === '/v1/setups') {
        const name = (body as { name: string }).name;
        if (name === 'Taken name')
          return jsonResponse(
            {
              title: 'Conflict',
              status: 409,
              errors: [{ field: 'name', reason: 'is already used in your organisation' }],
            },
            409,
            'application/problem+json',
          );
        return jsonResponse({ ...savedSetup, id: 'new-id', name }, 201);
      }
      return jsonResponse(savedSetup);
    };
    const save = within(panel).getByRole('button', { name: 'Save setup' });
    await waitFor(() => expect((save as HTMLButtonElement).disabled).toBe(false));
    fireEvent.click(save);
    const dialog = await screen.findByRole('dialog');
    expect(valueOf(within(dialog).getByLabelText('Date'))).toBe('2026-06-20');
    expect(valueOf(within(dialog).getByLabelText('Time zone'))).toBe('Europe/Zurich');
    expect(valueOf(within(dialog).getByLabelText('Venue (optional)'))).toBe(
      'Quillmere boathouse terrace',
    );

    fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Taken name' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
    expect(await within(dialog).findByText('Is already used in your organisation')).toBeTruthy();
    expect(within(dialog).getByLabelText('Name').getAttribute('aria-invalid')).toBe('true');

    fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Second look' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Save setup' }));
    expect(await within(panel).findByText(/Saved setup Second look/)).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());

    const posts = calls.filter((c) => c.method === 'POST' && c.path === '/v1/setups');
    expect(posts).toHaveLength(2);
    expect(posts[1]!.body).toEqual({
      name: 'Second look',
      venue: 'Quillmere boathouse terrace',
      inputs: {
        latitude: 47.1,
        longitude: 8.2,
        date: '2026-06-20',
        timeZone: 'Europe/Zurich',
        sky: 'partly-cloudy',
        camera: {
          aperture: 4,
          isoMax: 3200,
          support: 'tripod',
          flashSyncSeconds: 1 / 250,
          kelvin: 4000,
        },
        key: {
          guideNumber: 45,
          guideNumberUnit: 'm',
          distance: 3.5,
          distanceUnit: 'm',
          angleFromCameraDeg: 50,
          modifier: 'bare',
        },
        rim: {
          guideNumber: 36,
          guideNumberUnit: 'm',
          distanceBehind: 3.05,
          lightHeight: 1.52,
          distanceUnit: 'm',
          beamAngleDeg: 20,
          rimOverKeyStops: 0.5,
          gelled: false,
        },
        backgroundDistance: 15,
        conditions: {
          nearRoad: false,
          nearWater: true,
          coldFogOrHaze: false,
          modellingLamps: false,
        },
      },
    });
  });

  it('says so when the saved setup is not there, and hides Save from developers', async () => {
    const panel = await openPlayground('?setup=missing&calc=setup', 'developer');
    const alert = await within(panel).findByRole('alert');
    expect(alert.textContent).toContain('That saved setup was not found');
    expect(within(alert).getByRole('link', { name: 'Back to setups' })).toBeTruthy();
    expect(within(panel).queryByRole('button', { name: 'Save setup' })).toBeNull();
  });

  it('names the role problem on 403', async () => {
    respond = () =>
      jsonResponse({ title: 'Forbidden', status: 403 }, 403, 'application/problem+json');
    const panel = await openPlayground(`?setup=${SETUP_ID}&calc=setup`);
    const alert = await within(panel).findByRole('alert');
    expect(alert.textContent).toContain('Your role may not open saved setups');
  });
});

describe('Dusk setup: gel tolerance', () => {
  it('a new plan asks for up to 10 mired off (shorter stacks); 0 sends nothing (closest stack)', async () => {
    const panel = await openPlayground('?calc=setup');
    const camera = within(panel).getByRole('group', { name: 'Camera' });
    const field = within(camera).getByLabelText('Gels close enough (mired)');
    expect(valueOf(field)).toBe('10');
    const saved = () => calls.filter((c) => c.method === 'POST' && c.path === '/v1/setup');
    await waitFor(() => expect(saved().length).toBeGreaterThan(0));
    expect((saved().at(-1)!.body as { miredTolerance?: number }).miredTolerance).toBe(10);
    const before = saved().length;
    fireEvent.change(field, { target: { value: '0' } });
    await waitFor(() => expect(saved().length).toBeGreaterThan(before));
    expect(saved().at(-1)!.body).not.toHaveProperty('miredTolerance');
  });
});

describe('Dusk setup: darkest background bias', () => {
  const posted = () => calls.filter((c) => c.method === 'POST' && c.path === '/v1/setup');
  const cameraOf = (call: Call) => (call.body as { camera: Record<string, unknown> }).camera;

  it('sends nothing when empty (the bias stays fixed) and camera.biasFloorStops when given', async () => {
    const panel = await openPlayground('?calc=setup');
    const camera = within(panel).getByRole('group', { name: 'Camera' });
    const field = within(camera).getByLabelText('Darkest bias (stops)');
    expect(valueOf(field)).toBe('');
    await waitFor(() => expect(posted().length).toBeGreaterThan(0));
    expect(cameraOf(posted().at(-1)!)).not.toHaveProperty('biasFloorStops');
    const before = posted().length;
    fireEvent.change(field, { target: { value: '-2' } });
    await waitFor(() => expect(posted().length).toBeGreaterThan(before));
    expect(cameraOf(posted().at(-1)!)).toMatchObject({ biasStops: -1, biasFloorStops: -2 });
  });

  it('reopens a saved floor in its box and plans with it', async () => {
    const floored = { ...savedInputs, camera: { ...savedInputs.camera, biasFloorStops: -2.5 } };
    respond = ({ path }) =>
      path === `/v1/setups/${SETUP_ID}`
        ? jsonResponse({ ...savedSetup, inputs: floored, resolvedInputs: floored })
        : jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    const { panel } = await openSaved();
    const camera = within(panel).getByRole('group', { name: 'Camera' });
    expect(valueOf(within(camera).getByLabelText('Darkest bias (stops)'))).toBe('-2.5');
    await waitFor(() =>
      expect(posted().some((c) => cameraOf(c).biasFloorStops === -2.5)).toBe(true),
    );
  });
});
