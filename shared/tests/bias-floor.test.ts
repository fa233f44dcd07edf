import { describe, expect, it } from 'vitest';
import {
  computeTwilight,
  planDuskSetup,
  type DuskSetupInput,
  type SuggestedMinute,
} from '../src/index.js';

// An invented evening at 40.71° N on a tripod at f/2.8: the shutter waits at 1/15 s while ISO
// rises with the falling ambient, so a bare-ish key at a fixed distance soon needs less than its
// lowest power (1/256) at the default bias of -1.
const N = 2.8;
const GN = 40; // metres, ISO 100, full power
const MIN_POWER = 1 / 256;
const base = {
  latitude: 40.7128,
  longitude: -74.006,
  date: '2026-09-20',
  timeZone: 'America/New_York',
  stepMinutes: 1,
  suggestions: 10,
  camera: { aperture: N, isoMax: 6400, support: 'tripod' as const },
  key: { guideNumber: GN, distance: 2, modifierLossStops: 1 },
} satisfies DuskSetupInput;

const withCamera = (camera: Record<string, unknown>, key = base.key) =>
  planDuskSetup({ ...base, camera: { ...base.camera, ...camera }, key } as DuskSetupInput);

const clock = (m: SuggestedMinute) => m.time.slice(11, 16);

/**
 * ISO the background needs at a bias, from APEX (Kerr 2007, "APEX - The Additive System of
 * Photographic Exposure"): the settings expose for EV100 - bias, and EV = log2(N^2 / t) at ISO S
 * equals that EV100 + log2(S / 100), so S = 100 * 2^(log2(N^2 / t) - ev100 + bias).
 */
const isoAt = (ev100: number, t: number, bias: number) =>
  100 * 2 ** (Math.log2((N * N) / t) - ev100 + bias);

/**
 * Fraction of full power the key needs, from ISO 1230 (guide number = distance x f-number at ISO
 * 100, full power; GN scales with sqrt(ISO / 100) and sqrt(power); a loss of L stops divides it by
 * 2^(L / 2)). Exposures add, so the key gives only the share the ambient (2^bias of a correct
 * exposure, no shortfall) leaves: that share scales the power.
 */
const keyPowerAt = (iso: number, d: number, lossStops: number, bias: number) =>
  ((N * d * 2 ** (lossStops / 2)) / Math.sqrt(iso / 100) / GN) ** 2 * (1 - 2 ** bias);

describe('camera.biasFloorStops', () => {
  it('omitted: the plan is the plan at a fixed bias, no minute lowered', () => {
    const plain = withCamera({});
    // A floor equal to the bias leaves no darker bias to try: the same plan as before the floor.
    expect(withCamera({ biasFloorStops: -1 })).toEqual(plain);
    expect(plain.suggestedMinutes.length).toBeGreaterThan(0);
    for (const m of plain.suggestedMinutes) {
      expect(m.biasLoweredByStops).toBe(0);
      expect(m.background.biasStops).toBe(-1);
    }
  });

  it('lowers the bias of a minute whose key is too strong, to the brightest bias that works', () => {
    const plain = withCamera({});
    const floored = withCamera({ biasFloorStops: -2 });
    const lowered = floored.suggestedMinutes.filter((m) => m.biasLoweredByStops > 0);
    expect(lowered.length).toBeGreaterThan(0);
    // Fewer usable minutes than suggestions: every usable minute is listed, so none is missed.
    expect(plain.suggestedMinutes.length).toBeLessThan(10);
    expect(floored.suggestedMinutes.length).toBeLessThan(10);
    const plainTimes = plain.suggestedMinutes.filter((m) => m.usable).map(clock);
    const loss = 1 + floored.gels.gelLossStops;
    for (const m of lowered) {
      // Usable only thanks to the darker bias: not among the plan's usable minutes at -1.
      expect(m.usable).toBe(true);
      expect(plainTimes).not.toContain(clock(m));
      const used = m.background.biasStops;
      expect(used).toBeCloseTo(-1 - m.biasLoweredByStops, 6);
      // In whole thirds of a stop (to the hundredth).
      expect(
        Math.abs(m.biasLoweredByStops * 3 - Math.round(m.biasLoweredByStops * 3)),
      ).toBeLessThan(0.03);
      // The shutter waits at the 1/15 s ghosting limit (common practice, no source) and ISO
      // follows the bias one for one (APEX, Kerr 2007).
      expect(m.background.shutterSeconds).toBeCloseTo(1 / 15, 5);
      const t = m.background.shutterSeconds;
      expect(m.background.iso / isoAt(m.ambientEv100, t, used)).toBeCloseTo(1, 2);
      // The key's power at the bias used, from the guide-number relation (ISO 1230).
      const power = keyPowerAt(m.background.iso, 2, loss, used);
      expect(m.keyFlash.powerFraction / power).toBeCloseTo(1, 3);
      expect(power).toBeGreaterThanOrEqual(MIN_POWER * (1 - 1e-9));
      // Every brighter third-stop bias leaves the key below its lowest power (ISO 1230, APEX).
      for (let k = 0; k < Math.round(m.biasLoweredByStops * 3); k++) {
        const brighter = -1 - k / 3;
        const p = keyPowerAt(isoAt(m.ambientEv100, t, brighter), 2, loss, brighter);
        expect({ at: clock(m), brighter, tooStrong: p < MIN_POWER }).toEqual({
          at: clock(m),
          brighter,
          tooStrong: true,
        });
      }
    }
    // The floor widens the usable window at its end (the key runs out of low power late on).
    expect(Date.parse(floored.window.usableEnd!)).toBeGreaterThan(
      Date.parse(plain.window.usableEnd!),
    );
    expect(floored.window.usableStart).toBe(plain.window.usableStart);
  });

  it('never goes below the floor, and tries the floor itself between two steps', () => {
    let previousEnd = -Infinity;
    for (const floor of [-1.5, -1.67, -2, -3]) {
      const plan = withCamera({ biasFloorStops: floor });
      for (const m of plan.suggestedMinutes) {
        expect(m.background.biasStops).toBeGreaterThanOrEqual(floor);
        expect(m.biasLoweredByStops).toBeLessThanOrEqual(-1 - floor + 1e-9);
      }
      // A darker floor never ends the usable window sooner.
      const end = Date.parse(plan.window.usableEnd!);
      expect(end).toBeGreaterThanOrEqual(previousEnd);
      previousEnd = end;
    }
    // Between the -1.33 and -1.67 steps, a -1.5 floor is tried as it is.
    const used = withCamera({ biasFloorStops: -1.5 }).suggestedMinutes.map(
      (m) => m.background.biasStops,
    );
    expect(used).toContain(-1.5);
    expect(used.filter((b) => b !== -1 && b !== -1.33 && b !== -1.5)).toEqual([]);
    // A minute that needs a -2 bias stays unusable (and at -1) with a -1.67 floor.
    const needsTwo = withCamera({ biasFloorStops: -2 }).suggestedMinutes.filter(
      (m) => m.background.biasStops === -2,
    );
    expect(needsTwo.length).toBeGreaterThan(0);
    const shallow = withCamera({ biasFloorStops: -1.67 }).suggestedMinutes.map(clock);
    for (const m of needsTwo) expect(shallow).not.toContain(clock(m));
  });

  it('key over ambient and the lighting ratio follow the bias used', () => {
    // Key 1.2 m away: no minute is usable at -1, so the first suggested minute is a lowered one.
    const key = { guideNumber: GN, distance: 1.2, modifierLossStops: 1 };
    const plan = withCamera({ biasFloorStops: -3 }, key);
    const first = plan.suggestedMinutes[0]!;
    expect(first.biasLoweredByStops).toBeGreaterThan(0);
    // Lit side = key + ambient = 1; shadow side = ambient alone = 2^bias: ratio 2^-bias [DER].
    expect(plan.key.lightingRatio).toBeCloseTo(2 ** -first.background.biasStops, 1);
    expect(plan.key.lightingRatio).toBeGreaterThan(2.1); // not the 2:1 of the bias given
  });

  it('with no usable minute and no floor, says how dark a floor would free one', () => {
    const key = { guideNumber: GN, distance: 1.2, modifierLossStops: 1 };
    const plain = withCamera({}, key);
    expect(plain.window.usableStart).toBeNull();
    const w = plain.warnings.find((x) => x.code === 'no-usable-minute')!;
    const m = w.message.match(
      /darker would free (\d\d:\d\d): at a bias of (-[\d.]+) \(([\d.]+) stops? darker than -1\).*camera\.biasFloorStops of (-[\d.]+) or lower/,
    );
    expect(m).not.toBeNull();
    const [, at, bias, by, floor] = m!;
    expect(Number(bias)).toBeCloseTo(-1 - Number(by), 6);
    expect(floor).toBe(bias);
    // Taken as given, the floor frees that very minute, at that bias.
    const freed = withCamera({ biasFloorStops: Number(floor) }, key);
    const minute = freed.suggestedMinutes.find((x) => clock(x) === at);
    expect(minute?.usable).toBe(true);
    expect(minute?.background.biasStops).toBe(Number(bias));
    expect(freed.warnings.map((x) => x.code)).not.toContain('no-usable-minute');
  });

  it('with a floor given that is too shallow, says how much darker would free a minute', () => {
    const key = { guideNumber: GN, distance: 1.2, modifierLossStops: 1 };
    const floor = -1.33;
    const shallow = withCamera({ biasFloorStops: floor }, key);
    expect(shallow.window.usableStart).toBeNull();
    expect(shallow.window.usableSpans).toEqual([]);
    const w = shallow.warnings.find((x) => x.code === 'no-usable-minute')!;
    const m = w.message.match(
      /floor given \(camera\.biasFloorStops -1\.33\) is too shallow: a darker background would free (\d\d:\d\d): at a bias of (-[\d.]+) \(([\d.]+) stops? darker than -1\).*camera\.biasFloorStops of (-[\d.]+) or lower/,
    );
    expect(m).not.toBeNull();
    const [, at, bias, by, hinted] = m!;
    // Only biases below the floor are proposed, on the 1/3-stop grid from the bias given.
    expect(Number(bias)).toBeLessThan(floor);
    expect(Number(bias)).toBeCloseTo(-1 - Number(by), 6);
    expect(Math.abs(Number(by) * 3 - Math.round(Number(by) * 3))).toBeLessThan(0.03);
    expect(hinted).toBe(bias);
    // The key's power at that minute and bias is within range, and below it at the floor
    // (ISO 1230 guide-number relation with APEX ISO, as keyPowerAt and isoAt above).
    const freed = withCamera({ biasFloorStops: Number(hinted) }, key);
    const minute = freed.suggestedMinutes.find((x) => clock(x) === at)!;
    expect(minute.usable).toBe(true);
    expect(minute.background.biasStops).toBe(Number(bias));
    const loss = 1 + freed.gels.gelLossStops;
    const t = minute.background.shutterSeconds;
    const power = (b: number) => keyPowerAt(isoAt(minute.ambientEv100, t, b), 1.2, loss, b);
    expect(power(Number(bias))).toBeGreaterThanOrEqual(MIN_POWER * (1 - 1e-9));
    expect(power(floor)).toBeLessThan(MIN_POWER);
    expect(freed.warnings.map((x) => x.code)).not.toContain('no-usable-minute');
    // Without a floor the same search (from the bias given) lands on the same bias.
    const plain = withCamera({}, key).warnings.find((x) => x.code === 'no-usable-minute')!;
    expect(plain.message).toContain(`at a bias of ${bias} `);
  });

  it('does not lower the bias for a minute the background rules out', () => {
    // ISO ceiling 400 on the tripod: from the window's start the background stays darker than
    // wanted at 1/15 s (a background warning), and the key 1 m away is too strong as well. A
    // darker bias would meet both (from -2.33 at the first minute), but the floor only answers
    // a minute whose background fits, so the plan stays the one at -1.
    const camera = { isoMax: 400 };
    const key = { guideNumber: GN, distance: 1, modifierLossStops: 1 };
    const plain = withCamera(camera, key);
    const floored = withCamera({ ...camera, biasFloorStops: -6 }, key);
    expect(plain.window.usableStart).toBeNull();
    expect(floored.suggestedMinutes.length).toBeGreaterThan(0);
    for (const m of floored.suggestedMinutes) {
      expect(m.background.warnings.map((w) => w.code)).toContain('too-dark');
      expect(m.biasLoweredByStops).toBe(0);
    }
    expect(floored.suggestedMinutes[0]?.keyFlash.fixes?.addLossStops).toBeGreaterThan(0);
    expect(floored).toEqual(plain);
  });

  it("proposes no floor when no bias down to the library's -6 frees a minute", () => {
    // A GN 40 m key 0.3 m away, bare: at f/2.8 and ISO 100 it needs (2.8 x 0.3 / 40)^2 = 4.4e-4
    // of full power for a whole exposure (ISO 1230), under 1/256 at any bias, and ISO only rises.
    const key = { guideNumber: GN, distance: 0.3, modifierLossStops: 0 };
    expect(((N * 0.3) / GN) ** 2).toBeLessThan(MIN_POWER);
    for (const camera of [{}, { biasFloorStops: -1.5 }, { biasFloorStops: -6 }]) {
      const plan = withCamera(camera, key);
      expect(plan.window.usableStart).toBeNull();
      const w = plan.warnings.find((x) => x.code === 'no-usable-minute')!;
      expect(w.message).toMatch(/the key needs [\d.]+ stops less than its lowest power/);
      expect(w.message).not.toMatch(/biasFloorStops/);
    }
  });
});

describe('window.usableSpans with a floor', () => {
  // Hand-held at f/2.8 from ISO 800, the shutter held between sync (1/200 s) and a 1/160 s
  // hand-held limit: a narrow band. A GN 20 m key 0.8 m away is too strong at the bias given,
  // so each minute is lowered; a 1/3-stop step can jump from "key too strong" straight to
  // "faster than sync", which leaves a minute unusable between two usable ones.
  const SYNC = 1 / 200;
  const SLOWEST = 1 / 160;
  const ISO_MIN = 800;
  const gap = {
    ...base,
    camera: {
      aperture: N,
      isoMin: ISO_MIN,
      isoMax: 25600,
      support: 'handheld' as const,
      slowestHandheldSeconds: SLOWEST,
      flashSyncSeconds: SYNC,
      biasFloorStops: -6,
    },
    key: { guideNumber: 20, distance: 0.8, modifierLossStops: 1 },
  } satisfies DuskSetupInput;
  const runs = (p: ReturnType<typeof planDuskSetup>) =>
    p.window.usableSpans.map((r) => `${r.start.slice(11, 16)}-${r.end.slice(11, 16)}`);

  it('splits the usable minutes where one in the middle is ruled out', () => {
    const plan = planDuskSetup(gap);
    expect(runs(plan)).toEqual(['19:14-19:14', '19:16-19:20']);
    expect(plan.window.usableSpans.map((r) => r.lengthMinutes)).toEqual([0, 4]);
    // usableStart/usableEnd stay the first and last usable minute, across the gap.
    expect(plan.window.usableStart).toBe(plan.window.usableSpans[0]!.start);
    expect(plan.window.usableEnd).toBe(plan.window.usableSpans[1]!.end);
    // Six usable minutes, fewer than the ten suggestions asked for: all are listed, and they are
    // exactly the minutes the spans cover.
    const usable = plan.suggestedMinutes.filter((m) => m.usable).map(clock);
    expect(usable).toEqual(['19:14', '19:16', '19:17', '19:18', '19:19', '19:20']);
  });

  it('the minute in the gap is unusable at every bias down to the floor (APEX, ISO 1230)', () => {
    const plan = planDuskSetup(gap);
    const tw = computeTwilight({
      latitude: gap.latitude,
      longitude: gap.longitude,
      date: gap.date,
      timeZone: gap.timeZone,
      stepMinutes: 1,
    });
    const ev100 = tw.ambient.points.find((p) => p.time.slice(11, 16) === '19:15')!.ev100;
    const loss = 1 + plan.gels.gelLossStops;
    const failures = new Set<string>();
    // Every bias the planner may try: -1 and 1/3-stop steps down to -6.
    for (let k = 0; k <= 15; k++) {
      const bias = Math.round((-1 - k / 3) * 100) / 100;
      // APEX (Kerr 2007): at ISO S the shutter for EV100 - bias is t = N^2 / 2^(EV100 - bias +
      // log2(S / 100)); past the hand-held limit ISO rises to hold it there.
      let iso = ISO_MIN;
      let t = (N * N) / 2 ** (ev100 - bias + Math.log2(iso / 100));
      if (t > SLOWEST) {
        t = SLOWEST;
        iso = isoAt(ev100, t, bias);
      }
      if (t < SYNC) {
        failures.add('faster than sync');
        continue;
      }
      // ISO 1230 guide-number relation, the key's share 1 - 2^bias (exposures add).
      const power =
        ((N * 0.8 * 2 ** (loss / 2)) / Math.sqrt(iso / 100) / 20) ** 2 * (1 - 2 ** bias);
      expect({ bias, belowLowestPower: power < MIN_POWER }).toEqual({
        bias,
        belowLowestPower: true,
      });
      failures.add('below the lowest power');
    }
    // Both limits meet at this minute: the darker step that brings the key into range is
    // already faster than sync.
    expect([...failures].sort()).toEqual(['below the lowest power', 'faster than sync']);
  });

  it('joins minutes that are neighbours at the plan step', () => {
    // At a 2-minute step 19:15 is not on the timeline: 19:14 and 19:16 are neighbours.
    const plan = planDuskSetup({ ...gap, stepMinutes: 2 });
    expect(runs(plan)).toEqual(['19:14-19:20']);
    expect(plan.window.usableSpans[0]!.lengthMinutes).toBe(6);
  });

  it('is one span equal to usableStart-usableEnd when there is no gap, none when unusable', () => {
    const plan = withCamera({ biasFloorStops: -2 });
    expect(plan.window.usableSpans).toHaveLength(1);
    const [only] = plan.window.usableSpans;
    expect(only!.start).toBe(plan.window.usableStart);
    expect(only!.end).toBe(plan.window.usableEnd);
    const minutes = (Date.parse(only!.end) - Date.parse(only!.start)) / 60_000;
    expect(only!.lengthMinutes).toBeCloseTo(minutes, 1);
    const none = withCamera({}, { guideNumber: GN, distance: 1.2, modifierLossStops: 1 });
    expect(none.window.usableSpans).toEqual([]);
  });
});

describe('camera.biasFloorStops refusals name the field', () => {
  const fieldOf = (camera: Record<string, unknown>) => {
    try {
      withCamera(camera);
    } catch (e) {
      return { field: (e as { field?: string }).field, message: (e as Error).message };
    }
    return undefined;
  };
  it.each([
    ['brighter than the default bias', { biasFloorStops: -0.5 }, /camera\.biasStops, -1/],
    ['brighter than the bias given', { biasStops: -2, biasFloorStops: -1.9 }, /biasStops, -2/],
    ['below the range', { biasFloorStops: -6.01 }, /between -6 and 6/],
    ['above the range', { biasStops: 6, biasFloorStops: 6.5 }, /between -6 and 6/],
    ['not a number', { biasFloorStops: '-2' }, /must be a number/],
  ])('%s', (_name, camera, reason) => {
    const e = fieldOf(camera);
    expect(e?.field).toBe('camera.biasFloorStops');
    expect(e?.message).toMatch(reason);
  });
  it('takes a floor equal to the bias and the range ends, and nothing just past them', () => {
    expect(fieldOf({ biasFloorStops: -1 })).toBeUndefined();
    expect(fieldOf({ biasFloorStops: -6 })).toBeUndefined();
    expect(fieldOf({ biasStops: 6, biasFloorStops: 6 })).toBeUndefined();
    expect(fieldOf({ biasFloorStops: -1 + 1e-9 })?.field).toBe('camera.biasFloorStops');
    expect(fieldOf({ biasFloorStops: -6 - 1e-9 })?.field).toBe('camera.biasFloorStops');
  });
});
