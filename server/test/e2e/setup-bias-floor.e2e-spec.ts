// The dusk setup's background bias floor end to end: refused by name when it is out of range or
// brighter than the bias, and used by the plan when a minute's key is too strong.
import * as schemas from '../../src/compute/schemas/index.js';
import { compileSchema } from '../../src/compute/validation/json-schema.js';
import { bootApp, TestApp } from '../setup/app.js';
import { keyedOrg, KeyedOrg, post } from '../factories/compute.js';

// An invented evening at 40.71° N on a tripod at f/2.8, a 40 m key 2 m away with 1 stop of
// modifier loss: at the default bias (-1) the key runs out of low power a few minutes in.
const N = 2.8;
const evening = {
  latitude: 40.7128,
  longitude: -74.006,
  date: '2026-09-20',
  timeZone: 'America/New_York',
  stepMinutes: 1,
  suggestions: 10,
  camera: { aperture: N, support: 'tripod' },
  key: { guideNumber: 40, distance: 2, modifierLossStops: 1 },
};

interface Minute {
  time: string;
  usable: boolean;
  biasLoweredByStops: number;
  background: { biasStops: number; iso: number; aperture: number };
  keyFlash: { powerFraction: number };
}

describe('POST /v1/setup with camera.biasFloorStops', () => {
  let t: TestApp;
  let org: KeyedOrg;
  beforeAll(async () => {
    t = await bootApp();
    org = await keyedOrg(t.url);
  });
  afterAll(() => t.close());

  it.each([
    ['below the range', { biasFloorStops: -6.5 }, /-6/],
    ['above the range', { biasStops: 6, biasFloorStops: 7 }, /6/],
    ['brighter than the default bias', { biasFloorStops: -0.5 }, /camera\.biasStops/],
    ['brighter than the bias given', { biasStops: -2, biasFloorStops: -1 }, /camera\.biasStops/],
  ])('422 problem naming camera.biasFloorStops when %s', async (_name, camera, reason) => {
    const res = await post(t.url, 'setup', org.test.secret, {
      ...evening,
      camera: { ...evening.camera, ...camera },
    }).expect(422);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.errors).toEqual([
      expect.objectContaining({ field: 'camera.biasFloorStops', reason: expect.any(String) }),
    ]);
    expect(res.body.errors[0].reason).toMatch(reason);
  });

  it('plans darker minutes within the floor, at the key power the guide number gives', async () => {
    const plain = await post(t.url, 'setup', org.test.secret, evening).expect(200);
    const floored = await post(t.url, 'setup', org.test.secret, {
      ...evening,
      camera: { ...evening.camera, biasFloorStops: -2 },
    }).expect(200);
    expect(compileSchema(schemas.RESPONSE_SCHEMAS.setup!)(floored.body)).toEqual([]);
    const minutes = floored.body.suggestedMinutes as Minute[];
    const lowered = minutes.filter((m) => m.biasLoweredByStops > 0);
    expect(lowered.length).toBeGreaterThan(0);
    for (const m of plain.body.suggestedMinutes as Minute[]) expect(m.biasLoweredByStops).toBe(0);
    const gelLoss = floored.body.gels.gelLossStops as number;
    for (const m of lowered) {
      expect(m.usable).toBe(true);
      expect(m.background.biasStops).toBeCloseTo(-1 - m.biasLoweredByStops, 6);
      expect(m.background.biasStops).toBeGreaterThanOrEqual(-2);
      // ISO 1230: GN = distance x f-number at ISO 100, full power; GN scales with sqrt(ISO/100)
      // and sqrt(power), a loss of L stops divides it by 2^(L/2). Exposures add, so the key gives
      // the 1 - 2^bias of a correct exposure the ambient leaves (no shortfall on these minutes).
      const full =
        ((N * 2 * 2 ** ((1 + gelLoss) / 2)) / Math.sqrt(m.background.iso / 100) / 40) ** 2;
      const share = 1 - 2 ** m.background.biasStops;
      expect(m.keyFlash.powerFraction / (full * share)).toBeCloseTo(1, 3);
      expect(m.keyFlash.powerFraction).toBeGreaterThanOrEqual(1 / 256);
    }
    // The usable window ends later with the floor.
    expect(Date.parse(floored.body.window.usableEnd)).toBeGreaterThan(
      Date.parse(plain.body.window.usableEnd),
    );
  });
});
