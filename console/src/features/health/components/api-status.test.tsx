import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderApp } from '@/test/render';

function statusBadge() {
  return screen.getAllByRole('status').find((el) => el.hasAttribute('data-state'));
}

async function settledState() {
  await waitFor(() => expect(statusBadge()?.getAttribute('data-state')).not.toBe('checking'));
  return statusBadge()!;
}

describe('API status indicator', () => {
  it('asks /v1/health with the session cookie and shows up when the database is up', async () => {
    const fetchMock = vi.fn(async (_input: RequestInfo | URL, _init?: RequestInit) =>
      jsonResponse({ status: 'ok', info: { database: { status: 'up' } }, error: {}, details: {} }),
    );
    vi.stubGlobal('fetch', fetchMock);
    renderApp('/');
    const badge = await settledState();
    expect(badge.getAttribute('data-state')).toBe('up');
    expect(badge.textContent).toBe('API up');
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(new URL(String(url)).pathname).toBe('/v1/health');
    expect(init?.credentials).toBe('include');
  });

  it('shows down with the failing check when health answers 503', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        jsonResponse(
          {
            status: 'error',
            info: {},
            error: { database: { status: 'down', message: 'connection refused' } },
            details: { database: { status: 'down' } },
          },
          503,
        ),
      ),
    );
    renderApp('/');
    const badge = await settledState();
    expect(badge.getAttribute('data-state')).toBe('down');
    expect(badge.textContent).toBe('API down (HTTP 503)');
  });

  it('shows down when a 200 report says the database is down', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => jsonResponse({ status: 'ok', info: { database: { status: 'down' } } })),
    );
    renderApp('/');
    const badge = await settledState();
    expect(badge.textContent).toBe('API down (database down)');
  });

  it('shows down as unreachable when fetch itself fails', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    renderApp('/');
    const badge = await settledState();
    expect(badge.getAttribute('data-state')).toBe('down');
    expect(badge.textContent).toBe('API down (unreachable)');
  });
});
