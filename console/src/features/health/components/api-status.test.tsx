import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { stubApi } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { renderApp } from '@/test/render';

function statusBadge() {
  return screen.getAllByRole('status').find((el) => el.hasAttribute('data-state'));
}

async function settledState() {
  await waitFor(() => expect(statusBadge()).toBeDefined(), { timeout: 3000 });
  await waitFor(() => expect(statusBadge()?.getAttribute('data-state')).not.toBe('checking'));
  return statusBadge()!;
}

describe('API status indicator', () => {
  it('asks /v1/health with the session cookie and shows up when the database is up', async () => {
    const fetchMock = stubApi(undefined, () =>
      jsonResponse({ status: 'ok', info: { database: { status: 'up' } }, error: {}, details: {} }),
    );
    renderApp('/');
    const badge = await settledState();
    expect(badge.getAttribute('data-state')).toBe('up');
    expect(badge.textContent).toBe('API up');
    const call = fetchMock.mock.calls.find(
      ([url]) => new URL(url instanceof Request ? url.url : String(url)).pathname === '/v1/health',
    );
    expect(call).toBeDefined();
    expect(call![1]?.credentials).toBe('include');
  });

  it('shows down with the failing check when health answers 503', async () => {
    stubApi(undefined, () =>
      jsonResponse(
        {
          status: 'error',
          info: {},
          error: { database: { status: 'down', message: 'connection refused' } },
          details: { database: { status: 'down' } },
        },
        503,
      ),
    );
    renderApp('/');
    const badge = await settledState();
    expect(badge.getAttribute('data-state')).toBe('down');
    expect(badge.textContent).toBe('API down (HTTP 503)');
  });

  it('shows down when a 200 report says the database is down', async () => {
    stubApi(undefined, () =>
      jsonResponse({ status: 'ok', info: { database: { status: 'down' } } }),
    );
    renderApp('/');
    const badge = await settledState();
    expect(badge.textContent).toBe('API down (database down)');
  });

  it('shows down as unreachable when fetch itself fails', async () => {
    stubApi(undefined, () => {
      throw new TypeError('Failed to fetch');
    });
    renderApp('/');
    const badge = await settledState();
    expect(badge.getAttribute('data-state')).toBe('down');
    expect(badge.textContent).toBe('API down (unreachable)');
  });
});
