// Saved-setup test helpers: valid inputs for an invented lakeside evening, and a save call.
import type { SignedInAgent } from './accounts.js';

export const LAKESIDE_INPUTS = {
  latitude: 54.21,
  longitude: -2.47,
  date: '2026-09-12',
  timeZone: 'Europe/London',
  camera: { aperture: 4, isoMax: 3200 },
  key: { guideNumber: 60, distance: 2.2, angleFromCameraDeg: 50, modifier: 'octabox' },
  rim: { guideNumber: 36, distanceBehind: 3, lightHeight: 1.2, beamAngleDeg: 20 },
  backgroundDistance: 16,
  conditions: { windKmh: 12, nearWater: true },
};

export async function saveSetup(
  a: SignedInAgent,
  body: Partial<{ name: string; venue: string | null; notes: string | null; inputs: unknown }> = {},
) {
  const res = await a.agent.post('/v1/setups').send({
    name: `Setup ${Math.random().toString(36).slice(2, 8)}`,
    venue: 'Boathouse terrace, Tallowmere Water',
    inputs: LAKESIDE_INPUTS,
    ...body,
  });
  if (res.status !== 201)
    throw new Error(`save setup failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as Record<string, unknown> & { id: string; plan: Record<string, unknown> };
}
