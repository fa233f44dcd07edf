import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented demo data. Permissions as the server's role table gives them (auth/permissions.ts).
const reader = ['gear:read', 'playground:use', 'setups:read', 'profile:manage'];
const developer = {
  ...demoSession,
  role: 'developer' as const,
  permissions: [...reader, 'keys:manage-own', 'usage:read'],
};
const photographer = {
  ...demoSession,
  role: 'photographer' as const,
  permissions: [...reader, 'setups:manage'],
};

const quayShoot = {
  id: '7a4f0c1e-0000-4000-8000-000000000011',
  name: 'Quay steps, first dance',
  venue: 'Old ferry quay',
  notes: null,
  date: '2026-12-12',
  timeZone: 'Europe/Lisbon',
  windowStart: '2026-12-12T17:20:00Z',
  windowEnd: '2026-12-12T17:48:00Z',
  createdBy: { id: 'u-2', name: 'Demo Photographer' },
  createdAt: '2026-11-20T10:00:00Z',
  updatedAt: '2026-11-20T10:00:00Z',
};

function stubSetups(session: typeof demoSession) {
  return stubApi(
    (path) =>
      path === '/v1/setups'
        ? jsonResponse({ data: [quayShoot], nextCursor: null })
        : jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json'),
    undefined,
    session,
  );
}

describe('setups page', () => {
  it('lets a developer open setups and sheets but offers no change their role would refuse', async () => {
    stubSetups(developer);
    renderApp('/setups');
    const row = (await screen.findByText('Quay steps, first dance')).closest('tr')!;
    expect(within(row).getByRole('link', { name: /shot sheet/i })).toBeTruthy();
    expect(within(row).queryByRole('button', { name: /duplicate/i })).toBeNull();
    expect(within(row).queryByRole('button', { name: /delete/i })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Save a setup' })).toBeNull();
    expect(screen.getByText(/Your role can open saved setups/)).toBeTruthy();
  });

  it('gives a photographer save, duplicate and delete', async () => {
    stubSetups(photographer);
    renderApp('/setups');
    const row = (await screen.findByText('Quay steps, first dance')).closest('tr')!;
    expect(
      within(row).getByRole('button', { name: 'Duplicate Quay steps, first dance' }),
    ).toBeTruthy();
    expect(
      within(row).getByRole('button', { name: 'Delete Quay steps, first dance' }),
    ).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Save a setup' })).toBeTruthy();
    expect(screen.queryByText(/Your role can open saved setups/)).toBeNull();
  });
});
