import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

describe('audit page', () => {
  it('an empty log says what it will hold; an empty filter says how to see everything', async () => {
    const asked: string[] = [];
    stubApi((path, _init, request) => {
      asked.push(request.url);
      if (path.startsWith('/v1/audit')) return jsonResponse({ data: [], nextCursor: null });
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    });
    const first = renderApp('/audit');
    expect(await screen.findByText(/^Nothing recorded yet\./)).toBeTruthy();
    first.unmount();

    renderApp('/audit?action=key.rotated');
    expect(
      await screen.findByText('No key.rotated events. Clear the Action box to see every event.'),
    ).toBeTruthy();
    expect(asked.some((p) => p.includes('action=key.rotated'))).toBe(true);
  });
});
