import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented plans: the card shows live and test-key rates as the API lists them.
const plan = (code: string, name: string, rate: number, burst: number) => ({
  code,
  name,
  description: 'Invented for the test.',
  monthlyPriceCents: code === 'free' ? 0 : 1900,
  includedCallsPerMonth: 1000,
  testCallsPerMonth: 500,
  ratePerSecond: rate,
  burst,
  testKeyRatePerSecond: Math.min(rate, 10),
  testKeyBurst: Math.min(burst, 20),
  overagePricePer1000Cents: null,
  features: { uploads: false, savedSetups: 10, seats: 2 },
});
const plans = [plan('free', 'Starter', 5, 10), plan('studio', 'Workshop', 40, 80)];

describe('billing page plan cards', () => {
  it('shows each plan’s live-key and test-key rates', async () => {
    stubApi((path) => {
      if (path === '/v1/plans') return jsonResponse({ data: plans });
      if (path === '/v1/billing')
        return jsonResponse({ plan: plans[0], subscription: null, openCheckout: null });
      if (path === '/v1/billing/invoices') return jsonResponse({ data: [] });
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    renderApp('/billing');
    const card = (await screen.findByRole('heading', { level: 3, name: /^Workshop/ })).closest(
      'article',
    ) as HTMLElement;
    expect(within(card).getByText('40 calls/s (bursts of 80)')).toBeTruthy();
    expect(within(card).getByText('Test keys: 10 calls/s (bursts of 20)')).toBeTruthy();
    const starter = screen.getByRole('heading', { level: 3, name: /^Starter/ }).closest('article')!;
    expect(
      within(starter as HTMLElement).getByText('Test keys: 5 calls/s (bursts of 10)'),
    ).toBeTruthy();
  });

  it('says a paid plan set without a subscription has nothing to cancel, and only then', async () => {
    const billing = { plan: plans[1], subscription: null as unknown, openCheckout: null };
    stubApi((path) => {
      if (path === '/v1/plans') return jsonResponse({ data: plans });
      if (path === '/v1/billing') return jsonResponse(billing);
      if (path === '/v1/billing/invoices') return jsonResponse({ data: [] });
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    const { unmount } = renderApp('/billing');
    expect(
      await screen.findByText(/Workshop is set on this studio without a subscription/),
    ).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Cancel subscription' })).toBeNull();
    unmount();

    billing.plan = plans[0]!;
    renderApp('/billing');
    await screen.findByRole('heading', { level: 3, name: /^Starter/ });
    expect(screen.queryByText(/without a subscription/)).toBeNull();
  });
});
