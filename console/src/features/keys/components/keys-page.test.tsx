import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

const key = {
  id: '00000000-0000-4000-8000-000000000001',
  name: 'Booking app',
  environment: 'test',
  prefix: 'lw_test_abc123',
  createdAt: '2026-12-01T10:00:00Z',
  createdBy: { id: 'u-demo', name: 'Demo Owner' },
  expiresAt: null,
  lastUsedAt: null,
  previousSecretExpiresAt: null,
  revokedAt: null,
  rotatedAt: null,
  status: 'active',
};

describe('keys page', () => {
  it('lists keys, and shows a new key’s secret once with a warning', async () => {
    const keys = [key];
    stubApi(async (path) => {
      if (path === '/v1/keys') return jsonResponse({ data: keys, nextCursor: null });
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    // POSTs arrive as Request objects; route them by method.
    const base = globalThis.fetch;
    globalThis.fetch = (async (input: RequestInfo | URL, init?: RequestInit) => {
      if (input instanceof Request && input.method === 'POST' && input.url.endsWith('/v1/keys')) {
        const body = (await input.clone().json()) as { name: string };
        const created = { ...key, id: '00000000-0000-4000-8000-000000000002', name: body.name };
        keys.unshift(created);
        return jsonResponse({ ...created, secret: 'lw_test_secret_shown_once' }, 201);
      }
      return base(input, init);
    }) as typeof fetch;

    renderApp('/keys');
    const table = await screen.findByRole('table', { name: 'API keys' });
    expect(within(table).getByText('Booking app')).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Create key' }));
    const dialog = await screen.findByRole('dialog');
    fireEvent.change(within(dialog).getByLabelText('Name'), { target: { value: 'Gallery site' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Create key' }));

    const secret = (await screen.findByTestId('key-secret')) as HTMLInputElement;
    expect(secret.value).toBe('lw_test_secret_shown_once');
    expect(screen.getByText(/shown only once/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'I have stored it' }));
    expect(await screen.findByText('Gallery site')).toBeTruthy();
    expect(screen.queryByTestId('key-secret')).toBeNull();
  });
});
