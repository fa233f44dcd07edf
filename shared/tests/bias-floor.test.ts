import { describe, expect, it } from 'vitest';
import { planDuskSetup, type DuskSetupInput, type SuggestedMinute } from '../src/index.js';

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
    // With a floor given, the hint is not repeated.
    const tooShallow = withCamera({ biasFloorStops: -1.33 }, key);
    const again = tooShallow.warnings.find((x) => x.code === 'no-usable-minute');
    expect(again?.message).not.toMatch(/biasFloorStops/);
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
