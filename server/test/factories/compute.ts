// Compute test helpers: an organisation with keys, and valid demo bodies for every endpoint
// (the invented Harrowgate Lane Studio's riverside terrace shoot).
import request from 'supertest';
import { signUp, type SignedInAgent } from './accounts.js';

export interface KeyedOrg {
  owner: SignedInAgent;
  live: { id: string; secret: string };
  test: { id: string; secret: string };
}

export async function createKey(owner: SignedInAgent, environment: 'live' | 'test') {
  const res = await owner.agent.post('/v1/keys').send({ name: `${environment} key`, environment });
  if (res.status !== 201)
    throw new Error(`key create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { id: res.body.id as string, secret: res.body.secret as string };
}

export async function keyedOrg(url: string): Promise<KeyedOrg> {
  const owner = await signUp(url, { organizationName: 'Harrowgate Lane Studio' });
  return { owner, live: await createKey(owner, 'live'), test: await createKey(owner, 'test') };
}

export const DEMO_BODIES: Record<string, Record<string, unknown>> = {
  twilight: { latitude: 51.507, longitude: -0.1, date: '2026-06-20', timeZone: 'Europe/London' },
  exposure: { ev100: 9, aperture: 4, iso: 400 },
  flash: {
    guideNumber: 60,
    guideNumberUnit: 'm',
    distance: 3,
    distanceUnit: 'm',
    aperture: 5.6,
    iso: 200,
    modifierLossStops: 1.5,
    gelLossStops: 0.67,
  },
  falloff: { subjectDistance: 2.5, backgroundDistance: 9, distanceUnit: 'm' },
  backlight: { lightHeight: 2, distanceBehind: 3, distanceUnit: 'm' },
  balance: { cameraKelvin: 3800, flashKelvin: 5600 },
  setup: {
    latitude: 51.507,
    longitude: -0.1,
    date: '2026-06-20',
    timeZone: 'Europe/London',
    key: { guideNumber: 60, distance: 2.5 },
  },
  timeline: {
    latitude: 51.507,
    longitude: -0.1,
    date: '2026-06-20',
    timeZone: 'Europe/London',
    events: [
      { label: 'Dinner', start: '19:00', end: '21:15' },
      { label: 'Speeches', start: '21:15', end: '21:40' },
    ],
    portraitMinutes: 20,
  },
};

export const ENDPOINTS = Object.keys(DEMO_BODIES);

export const post = (url: string, endpoint: string, secret: string, body: unknown) =>
  request(url)
    .post(`/v1/${endpoint}`)
    .set('Authorization', `Bearer ${secret}`)
    .send(body as object);
