import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented demo data.
const photographer = {
  ...demoSession,
  role: 'photographer' as const,
  permissions: ['gear:read', 'playground:use', 'setups:read', 'setups:manage', 'profile:manage'],
};
const owner = {
  ...demoSession,
  permissions: [...demoSession.permissions, 'gear:read', 'gear:manage', 'setups:read'],
};

const harbourShoot = {
  id: '7a4f0c1e-0000-4000-8000-000000000001',
  name: 'Harbour wall portraits',
  venue: 'North pier',
  notes: null,
  date: '2026-12-05',
  timeZone: 'Asia/Tokyo',
  // 16:45–17:10 in Tokyo (UTC+9), 07:45–08:10 UTC.
  windowStart: '2026-12-05T07:45:00Z',
  windowEnd: '2026-12-05T08:10:00Z',
  createdBy: null,
  createdAt: '2026-11-20T10:00:00Z',
  updatedAt: '2026-11-20T10:00:00Z',
};
const polarShoot = {
  ...harbourShoot,
  id: '7a4f0c1e-0000-4000-8000-000000000002',
  name: 'Ice camp, midday glow',
  venue: null,
  date: '2026-12-15',
  timeZone: 'UTC',
  windowStart: null,
  windowEnd: null,
};

function stubUpcoming(data: unknown[], session: typeof demoSession = photographer) {
  return stubApi(
    (path) =>
      path === '/v1/setups/upcoming'
        ? jsonResponse({ data })
        : jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json'),
    undefined,
    session,
  );
}

describe('overview', () => {
  it('shows a photographer the next shoots with windows in the shoot’s own time zone', async () => {
    stubUpcoming([harbourShoot, polarShoot]);
    renderApp('/');
    const list = await screen.findByTestId('upcoming-shoots');
    const items = within(list).getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(items[0]!.textContent).toContain('Harbour wall portraits');
    expect(items[0]!.textContent).toContain('North pier');
    // Tokyo's local hours (16:45, 24-hour as everywhere in the console), not the UTC ones (07:45).
    expect(items[0]!.textContent).toMatch(/16:45–17:10/);
    expect(items[0]!.textContent).not.toMatch(/07:45/);
    expect(items[0]!.textContent).not.toMatch(/7:45/);
    expect(items[1]!.textContent).toContain('No shooting window that day (polar day or night)');
    const open = within(items[0]!).getByRole('link', {
      name: 'Open Harbour wall portraits in the playground',
    });
    expect(open.getAttribute('href')).toContain(harbourShoot.id);
    // Only the starts this role can use: no key creation, the read-only gear card.
    expect(screen.queryByRole('link', { name: 'Create an API key' })).toBeNull();
    expect(screen.queryByRole('link', { name: 'List your gear' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Your studio’s gear' })).toBeTruthy();
  });

  it('says how to add a shoot when none is ahead, and gives owners every start', async () => {
    stubUpcoming([], owner);
    renderApp('/');
    expect(await screen.findByText(/No shoots ahead/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Create an API key' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'List your gear' })).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Your studio’s gear' })).toBeNull();
  });
  it('offers "Try again" when the shoots could not be loaded, and shows them once they come', async () => {
    let calls = 0;
    stubApi(
      (path) => {
        if (path !== '/v1/setups/upcoming')
          return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
        calls++;
        return calls === 1
          ? jsonResponse(
              { title: 'Bad Gateway', status: 502, detail: 'The shoots list is not answering.' },
              502,
              'application/problem+json',
            )
          : jsonResponse({ data: [harbourShoot] });
      },
      undefined,
      photographer,
    );
    renderApp('/');
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('The shoots list is not answering.');
    within(alert).getByRole('button', { name: 'Try again' }).click();
    const list = await screen.findByTestId('upcoming-shoots');
    expect(within(list).getAllByRole('listitem')).toHaveLength(1);
    expect(calls).toBe(2);
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
