import { fireEvent, screen, within } from '@testing-library/react';
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
