// The dusk setup's background bias floor end to end: refused by name when it is out of range or
// brighter than the bias, used by the plan when a minute's key is too strong, hinted at when it
// is too shallow, and the runs of usable minutes it can leave with a gap between them.
import * as schemas from '../../src/compute/schemas/index.js';
import { compileSchema } from '../../src/compute/validation/json-schema.js';
import { bootApp, TestApp } from '../setup/app.js';
import { keyedOrg, KeyedOrg, post } from '../factories/compute.js';
import { EVENING_40N, GAP_EVENING } from '../factories/dusk-evenings.js';

// An invented evening at 40.71° N on a tripod at f/2.8, a 40 m key 2 m away with 1 stop of
// modifier loss: at the default bias (-1) the key runs out of low power a few minutes in.
const N = 2.8;
const evening = {
  ...EVENING_40N,
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

let t: TestApp;
let org: KeyedOrg;
beforeAll(async () => {
  t = await bootApp();
  org = await keyedOrg(t.url);
});
afterAll(() => t.close());

describe('POST /v1/setup with camera.biasFloorStops', () => {
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

  it('says how much darker than a floor too shallow would free a minute', async () => {
    // The key 1.2 m away: no minute is usable down to -1.33 (shared/tests/bias-floor.test.ts).
    const res = await post(t.url, 'setup', org.test.secret, {
      ...evening,
      camera: { ...evening.camera, biasFloorStops: -1.33 },
      key: { ...evening.key, distance: 1.2 },
    }).expect(200);
    expect(res.body.window.usableSpans).toEqual([]);
    const w = (res.body.warnings as Array<{ code: string; message: string }>).find(
      (x) => x.code === 'no-usable-minute',
    );
    const hinted = Number(
      w?.message.match(
        /-1\.33\) is too shallow.*camera\.biasFloorStops of (-[\d.]+) or lower/,
      )?.[1],
    );
    expect(hinted).toBeLessThan(-1.33);
    // Taken as given, the floor hinted at frees a minute.
    const freed = await post(t.url, 'setup', org.test.secret, {
      ...evening,
      camera: { ...evening.camera, biasFloorStops: hinted },
      key: { ...evening.key, distance: 1.2 },
    }).expect(200);
    expect(freed.body.window.usableSpans.length).toBeGreaterThan(0);
  });
});

describe('POST /v1/setup usable runs (window.usableSpans)', () => {
  const gap = GAP_EVENING;
  interface Span {
    start: string;
    end: string;
    lengthMinutes: number;
  }

  it('answers two runs with a gap, matching the usable minutes listed', async () => {
    const res = await post(t.url, 'setup', org.test.secret, gap).expect(200);
    expect(compileSchema(schemas.RESPONSE_SCHEMAS.setup!)(res.body)).toEqual([]);
    const spans = res.body.window.usableSpans as Span[];
    expect(spans).toHaveLength(2);
    expect(res.body.window.usableStart).toBe(spans[0]!.start);
    expect(res.body.window.usableEnd).toBe(spans[1]!.end);
    // Reference: fewer usable minutes than the ten suggestions asked for, so all are listed;
    // grouping them where two follow each other by the 1-minute step (a plain construction,
    // common practice, no source) gives the same runs.
    const usable = (res.body.suggestedMinutes as Minute[]).filter((m) => m.usable);
    expect(usable.length).toBeLessThan(10);
    const expected: Span[] = [];
    for (const m of usable) {
      const last = expected[expected.length - 1];
      if (last && Date.parse(m.time) - Date.parse(last.end) === 60_000) {
        last.end = m.time;
        last.lengthMinutes += 1;
      } else expected.push({ start: m.time, end: m.time, lengthMinutes: 0 });
    }
    expect(spans).toEqual(expected);
    // A real gap: at least one planned minute lies between the two runs.
    expect(Date.parse(spans[1]!.start) - Date.parse(spans[0]!.end)).toBeGreaterThan(60_000);
    // Every usable minute here is planned darker than the bias given (lowered within the floor).
    for (const m of usable) expect(m.background.biasStops).toBeLessThan(-1);
  });

  it('joins the same minutes at a 2-minute step, where the gap minute is not planned', async () => {
    const res = await post(t.url, 'setup', org.test.secret, { ...gap, stepMinutes: 2 }).expect(200);
    const spans = res.body.window.usableSpans as Span[];
    expect(spans).toHaveLength(1);
    expect(spans[0]!.lengthMinutes).toBe(
      (Date.parse(spans[0]!.end) - Date.parse(spans[0]!.start)) / 60_000,
    );
  });
});
