import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented plan data.
const current = (uploads: boolean, name: string) => ({
  plan: {
    code: name.toLowerCase(),
    name,
    description: 'Invented for the test.',
    monthlyPriceCents: 0,
    includedCallsPerMonth: 2000,
    testCallsPerMonth: 2000,
    ratePerSecond: 5,
    burst: 10,
    testKeyRatePerSecond: 5,
    testKeyBurst: 10,
    overagePricePer1000Cents: null,
    features: { uploads, savedSetups: 10, seats: 2 },
  },
  periodStart: '2026-12-01',
  resetsAt: '2027-01-01T00:00:00.000Z',
  usage: { liveCalls: 0, testCalls: 0, consoleCalls: 0, billableUnits: 0 },
});

function stub(uploads: boolean, name: string) {
  stubApi((path) => {
    if (path === '/v1/plans/current') return jsonResponse(current(uploads, name));
    if (path === '/v1/frames') return jsonResponse({ data: [], nextCursor: null });
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
}

describe('test frames page', () => {
  it('says up front when the plan has no uploads, instead of offering a file to pick', async () => {
    stub(false, 'Starter');
    renderApp('/frames');
    const heading = await screen.findByText('Test-frame uploads aren’t in the Starter plan.');
    expect(document.querySelector('input[type="file"]')).toBeNull();
    const notice = heading.closest('[role="status"]') as HTMLElement;
    expect(within(notice).getByRole('link', { name: 'Billing' }).getAttribute('href')).toBe(
      '/billing',
    );
  });

  it('offers the file picker on a plan with uploads', async () => {
    stub(true, 'Studio');
    renderApp('/frames');
    await screen.findByText('Drop a test frame here, or choose a file');
    expect(document.querySelector('input[type="file"]')).not.toBeNull();
    expect(screen.queryByText(/aren’t in the/)).toBeNull();
  });

  it('asks for the latest twelve frames with a whole-number limit', async () => {
    const seen: URL[] = [];
    stubApi((path, _init, request) => {
      if (path === '/v1/plans/current') return jsonResponse(current(true, 'Studio'));
      if (path === '/v1/frames') {
        seen.push(new URL(request.url));
        return jsonResponse({ data: [], nextCursor: null });
      }
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    renderApp('/frames');
    await screen.findByText('Drop a test frame here, or choose a file');
    await vi.waitFor(() => expect(seen.length).toBeGreaterThan(0));
    expect(seen[0]!.searchParams.get('limit')).toBe('12');
  });

  it('refuses a file named as a JPEG that is not one, before any preview', async () => {
    stub(true, 'Studio');
    renderApp('/frames');
    await screen.findByText('Drop a test frame here, or choose a file');
    const input = document.querySelector('input[type="file"]') as HTMLInputElement;
    const fake = new File(['just some notes, not pixels'], 'notes.jpg', { type: 'image/jpeg' });
    fireEvent.change(input, { target: { files: [fake] } });
    expect(
      await screen.findByText('“notes.jpg” is named as an image but is not a JPEG or PNG inside.'),
    ).toBeTruthy();
    expect(screen.queryByText('Mark the neutral patch')).toBeNull();
  });

  it('shows the preview for a real PNG and holds back a white balance the server would refuse', async () => {
    stub(true, 'Studio');
    renderApp('/frames');
    await screen.findByText('Drop a test frame here, or choose a file');
    const input = document.querySelector('input[type="file"]') as HTMLInputElement;
    // The 8-byte PNG signature (PNG specification, section 5.2) and nothing else is enough here.
    const png = new File(
      [new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])],
      'card.png',
      {
        type: 'image/png',
      },
    );
    fireEvent.change(input, { target: { files: [png] } });
    await screen.findByText('Mark the neutral patch');
    fireEvent.change(screen.getByLabelText('Camera white balance (K, optional)'), {
      target: { value: '1000' },
    });
    expect(
      screen.getByText('Enter whole kelvin from 1500 to 20000, or leave it empty.'),
    ).toBeTruthy();
    expect(
      (screen.getByRole('button', { name: 'Upload and measure' }) as HTMLButtonElement).disabled,
    ).toBe(true);
  });
});

// An invented frame as the API answers it, with one coded warning and two coded notes.
const frame = (id: string, fileName: string) => ({
  id,
  fileName,
  contentType: 'image/png',
  byteSize: 1234,
  sha256: 'ab'.repeat(32),
  width: 64,
  height: 48,
  thumbnailUrl: `/v1/frames/${id}/thumbnail`,
  exif: {
    exposureTime: null,
    fNumber: null,
    iso: null,
    whiteBalance: null,
    flashFired: null,
    focalLengthMm: null,
  },
  patch: {
    x: 0,
    y: 0,
    width: 64,
    height: 48,
    source: 'caller',
    linearRgb: { r: 0.5, g: 0.5, b: 0.5 },
    luminance: 0.5,
    luminanceCv: 0.3,
    clippedFraction: 0,
  },
  colour: {
    chromaticity: { x: 0.3127, y: 0.329 },
    cctKelvin: 6504,
    duv: 0.003,
    cctMeaningful: true,
    method: 'robertson-1968',
    neutral: { x: 0.3127, y: 0.329, cctKelvin: 6504 },
    miredOffset: 0,
    tint: 'none',
    cameraKelvin: 5500,
    cameraKelvinSource: 'assumed',
    lightKelvin: 5500,
    whiteBalance: { kelvin: 5500, miredShift: 0, amberBlueSteps: 0 },
    gel: null,
    notes: [
      { code: 'camera-white-balance-assumed', message: 'Invented note: 5500 K assumed.' },
      { code: 'unclassified', message: 'Invented older note.' },
    ],
  },
  exposure: { settingsEv100: null, patchLuminance: 0.5, sceneEv100: null, basis: 'Invented.' },
  warnings: [{ code: 'patch-uneven', message: 'Invented warning: the patch is uneven.' }],
  createdAt: '2026-12-01T17:30:00.000Z',
});

const pngFile = () =>
  // The 8-byte PNG signature (PNG specification, section 5.2): enough for the page's check.
  new File([new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])], 'card.png', {
    type: 'image/png',
  });

describe('test frames: warnings, deleting, retrying an upload', () => {
  it('shows a frame’s coded warnings and notes as sentences', async () => {
    stubApi((path) => {
      if (path === '/v1/plans/current') return jsonResponse(current(true, 'Studio'));
      if (path === '/v1/frames')
        return jsonResponse({ data: [frame('f-1', 'terrace.png')], nextCursor: null });
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    renderApp('/frames');
    fireEvent.click(await screen.findByText(/terrace\.png/));
    const result = await screen.findByTestId('frame-result');
    const warnings = within(result).getByRole('list', { name: 'Warnings' });
    const warning = within(warnings).getByText('Invented warning: the patch is uneven.');
    expect(warning.getAttribute('data-code')).toBe('patch-uneven');
    const notes = within(result).getByRole('list', { name: 'Notes' });
    expect(
      within(notes)
        .getAllByRole('listitem')
        .map((li) => [li.getAttribute('data-code'), li.textContent]),
    ).toEqual([
      ['camera-white-balance-assumed', 'Invented note: 5500 K assumed.'],
      ['unclassified', 'Invented older note.'],
    ]);
  });

  it('deletes a frame only after the confirm dialog, then lists what is left', async () => {
    let listed = [frame('f-1', 'terrace.png'), frame('f-2', 'pier.png')];
    const deleted: string[] = [];
    stubApi((path, _init, request) => {
      if (path === '/v1/plans/current') return jsonResponse(current(true, 'Studio'));
      if (path === '/v1/frames') return jsonResponse({ data: listed, nextCursor: null });
      const id = /^\/v1\/frames\/([^/]+)$/.exec(path)?.[1];
      if (id && request.method === 'DELETE') {
        deleted.push(id);
        listed = listed.filter((f) => f.id !== id);
        return new Response(null, { status: 204 });
      }
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    renderApp('/frames');
    await screen.findByText(/pier\.png/);
    const pierDelete = screen.getByRole('button', { name: /^Delete pier\.png/ });
    // Cancel first: nothing is sent.
    fireEvent.click(pierDelete);
    let dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('Delete pier.png?')).toBeTruthy();
    fireEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(deleted).toEqual([]);
    // Then confirm.
    fireEvent.click(pierDelete);
    dialog = await screen.findByRole('dialog');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Delete frame' }));
    await waitFor(() => expect(screen.queryByText(/pier\.png/)).toBeNull());
    expect(deleted).toEqual(['f-2']);
    expect(screen.getByText(/terrace\.png/)).toBeTruthy();
  });

  it('sends one Idempotency-Key per upload, the same again when retried after a network failure', async () => {
    const keys: (string | null)[] = [];
    let failNext = true;
    stubApi((path, _init, request) => {
      if (path === '/v1/plans/current') return jsonResponse(current(true, 'Studio'));
      if (path === '/v1/frames' && request.method === 'POST') {
        keys.push(request.headers.get('idempotency-key'));
        if (failNext) {
          failNext = false;
          throw new TypeError('Failed to fetch');
        }
        return jsonResponse(frame('f-9', 'card.png'), 201);
      }
      if (path === '/v1/frames') return jsonResponse({ data: [], nextCursor: null });
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    renderApp('/frames');
    await screen.findByText('Drop a test frame here, or choose a file');
    const input = document.querySelector('input[type="file"]') as HTMLInputElement;
    fireEvent.change(input, { target: { files: [pngFile()] } });
    const button = await screen.findByRole('button', { name: 'Upload and measure' });
    fireEvent.click(button);
    await waitFor(() => expect(keys).toHaveLength(1));
    await screen.findByText('The server could not be reached. Check your connection.');
    fireEvent.click(await screen.findByRole('button', { name: 'Upload and measure' }));
    await screen.findByTestId('frame-result');
    // After the success, uploading the same file again is a new upload: a new key.
    fireEvent.click(await screen.findByRole('button', { name: 'Upload and measure' }));
    await waitFor(() => expect(keys).toHaveLength(3));
    expect(keys[0]).toMatch(
      /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/,
    );
    expect(keys[1]).toBe(keys[0]);
    expect(keys[2]).not.toBe(keys[0]);
  });
});
