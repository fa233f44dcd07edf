import { fireEvent, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// An invented studio's gear.
const stamps = { createdAt: '2026-11-02T10:00:00Z', updatedAt: '2026-11-02T10:00:00Z' };
const light = {
  id: '7d1e2c4a-1111-4000-8000-00000000000a',
  name: 'Porch strobe',
  guideNumber: 44,
  guideNumberUnit: 'm',
  guideNumberM: 44,
  guideNumberFt: 144.4,
  meterReading: null,
  notes: null,
  ...stamps,
};
const modifier = {
  id: '9b0f5e3d-2222-4000-8000-00000000000b',
  name: 'Shallow octa',
  kind: 'octabox',
  lossStops: 1.5,
  size: 0.9,
  sizeUnit: 'm',
  beamAngleDeg: null,
  notes: null,
  ...stamps,
};
const kit = {
  id: 'c3a8d6f1-3333-4000-8000-00000000000c',
  name: 'Warming kit',
  notes: null,
  pieces: [{ id: 'p1', name: '1/2 CTO', miredShift: 81, greenShift: 0, lossStops: 0.3 }],
  ...stamps,
};

function stubGear(session = demoSession) {
  return stubApi(
    async (path) => {
      if (path === '/v1/gear/lights') return jsonResponse({ data: [light] });
      if (path === '/v1/gear/modifiers') return jsonResponse({ data: [modifier] });
      if (path === '/v1/gear/gel-kits') return jsonResponse({ data: [kit] });
      return jsonResponse({ title: 'Not found', status: 404 }, 404, 'application/problem+json');
    },
    undefined,
    session,
  );
}

afterEach(() => vi.unstubAllGlobals());

describe('gear page', () => {
  it('shows roles that build against the API each item’s id, and copies the whole id', async () => {
    stubGear();
    const writeText = vi.fn(async () => undefined);
    Object.defineProperty(navigator, 'clipboard', { value: { writeText }, configurable: true });
    renderApp('/gear');
    const lights = await screen.findByRole('table', { name: 'Lights' });
    expect(within(lights).getByText('API id')).toBeTruthy();
    expect(within(lights).getByText('7d1e2c4a…')).toBeTruthy();
    fireEvent.click(within(lights).getByRole('button', { name: 'Copy id of Porch strobe' }));
    expect(await within(lights).findByText('Copied')).toBeTruthy();
    expect(writeText).toHaveBeenCalledWith(light.id);
    const modifiers = await screen.findByRole('table', { name: 'Modifiers' });
    fireEvent.click(within(modifiers).getByRole('button', { name: 'Copy id of Shallow octa' }));
    expect(writeText).toHaveBeenLastCalledWith(modifier.id);
    const kitCard = screen.getByRole('region', { name: 'Gel kit Warming kit' });
    fireEvent.click(within(kitCard).getByRole('button', { name: 'Copy id of Warming kit' }));
    expect(writeText).toHaveBeenLastCalledWith(kit.id);
  });

  it('leaves the ids out for a photographer, who does not use keys', async () => {
    stubGear({
      ...demoSession,
      role: 'photographer',
      permissions: demoSession.permissions.filter(
        (p) => !['keys:manage-own', 'usage:read', 'team:manage', 'audit:read'].includes(p),
      ),
    });
    renderApp('/gear');
    const lights = await screen.findByRole('table', { name: 'Lights' });
    expect(within(lights).getByText('Porch strobe')).toBeTruthy();
    expect(within(lights).queryByText('API id')).toBeNull();
    expect(screen.queryByRole('button', { name: /Copy id of/ })).toBeNull();
  });
});
