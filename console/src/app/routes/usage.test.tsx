import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented demo data.
const siteKey = '0b9c2e40-0000-4000-8000-000000000001';
const otherKey = '77aa1200-0000-4000-8000-000000000002';
const event = (id: string, keyId: string | null, source: string) => ({
  id,
  occurredAt: '2026-12-01T18:05:00Z',
  keyId,
  userId: null,
  source,
  endpoint: 'twilight',
  status: 200,
  latencyMs: 4.2,
  billableUnits: source === 'live' ? 1 : 0,
  requestId: `req-${id}`,
});

function stub() {
  return stubApi(
    (path) => {
      if (path === '/v1/usage/summary') {
        return jsonResponse({
          from: '2026-12-01',
          to: '2026-12-01',
          totals: { calls: 3, billableUnits: 1, errors: 0, meanLatencyMs: 4.2 },
          byDay: [],
          byEndpoint: [],
          byKey: [],
          byStatus: [],
          bySource: [],
        });
      }
      if (path === '/v1/usage/events') {
        return jsonResponse({
          data: [
            event('e1', siteKey, 'live'),
            event('e2', otherKey, 'test'),
            event('e3', null, 'console'),
          ],
          nextCursor: null,
        });
      }
      if (path === '/v1/keys') {
        return jsonResponse({
          data: [
            {
              id: siteKey,
              name: 'Gallery site',
              environment: 'live',
              prefix: 'lw_live_abc',
              status: 'active',
              createdBy: null,
              createdAt: '2026-11-01T00:00:00Z',
              expiresAt: null,
              lastUsedAt: null,
              revokedAt: null,
              rotatedAt: null,
              previousSecretExpiresAt: null,
            },
          ],
          nextCursor: null,
        });
      }
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    },
    undefined,
    demoSession,
  );
}

describe('usage page', () => {
  it('labels calls with the key’s name when the member can see the key, and filters by key', async () => {
    stub();
    renderApp('/usage');
    await screen.findByText('Gallery site');
    const table = screen.getByRole('table', { name: 'Calls' });
    expect(within(table).getByText('Gallery site')).toBeTruthy();
    // Another member's key stays an id; console calls have no key.
    expect(within(table).getByText('77aa1200…')).toBeTruthy();
    const keySelect = screen.getByLabelText('Key') as HTMLSelectElement;
    const options = [...keySelect.options].map((o) => o.textContent);
    expect(options).toEqual(['All', 'Gallery site (live)']);
  });

  it('narrows the chart and totals with the same filters as the list', async () => {
    const mock = stub();
    renderApp('/usage?endpoint=flash&status=429&from=2026-12-01&to=2026-12-02');
    await screen.findByRole('heading', { name: 'Calls by day (filtered)' });
    const urls = mock.mock.calls.map(
      ([input]) =>
        new URL(input instanceof Request ? input.url : String(input), 'http://localhost'),
    );
    const summary = urls.find((u) => u.pathname === '/v1/usage/summary')!;
    expect(Object.fromEntries(summary.searchParams)).toEqual({
      from: '2026-12-01',
      to: '2026-12-02',
      endpoint: 'flash',
      status: '429',
    });
  });

  it('refuses a range that ends before it starts, and names address filters it left out', async () => {
    const mock = stub();
    const { router } = renderApp('/usage?endpoint=teleport');
    expect(
      await screen.findByText(
        /Left out of the filters from this page’s address: endpoint “teleport” is not one of ours/,
      ),
    ).toBeTruthy();
    fireEvent.change(screen.getByLabelText('From (UTC day)'), { target: { value: '2026-12-10' } });
    fireEvent.change(screen.getByLabelText('To (UTC day)'), { target: { value: '2026-12-01' } });
    const before = mock.mock.calls.length;
    fireEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(
      await screen.findByText(
        '“From” (2026-12-10) is after “To” (2026-12-01): pick a From day on or before it.',
      ),
    ).toBeTruthy();
    await waitFor(() => expect(router.state.location.search).toBe('?endpoint=teleport'));
    expect(mock.mock.calls.length).toBe(before);
  });
});
