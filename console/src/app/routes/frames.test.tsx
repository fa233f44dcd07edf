import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
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
});
