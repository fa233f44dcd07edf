import { getPosition } from 'suncalc';
import { describe, expect, it } from 'vitest';
import { CAUTION_DEFERENCE, cautionAdvice, computeFlash, planDuskSetup } from '../src/index.js';

const input = {
  latitude: 40.7128,
  longitude: -74.006,
  date: '2026-09-20',
  timeZone: 'America/New_York',
  camera: { aperture: 4, isoMax: 6400, flashSyncSeconds: 1 / 200 },
  key: { guideNumber: 40, distance: 2, modifier: 'softbox' as const },
  rim: { guideNumber: 30, distanceBehind: 1.8, lightHeight: 1.0, beamAngleDeg: 20 },
  backgroundDistance: 30,
  conditions: { windKmh: 35, nearRoad: true, coldFogOrHaze: true },
};

describe('planDuskSetup', () => {
  const plan = planDuskSetup(input);
  it('is plain JSON (survives a round trip unchanged)', () => {
    expect(JSON.parse(JSON.stringify(plan))).toEqual(plan);
  });
  it('suggests minutes inside the window, in time order', () => {
    expect(plan.suggestedMinutes.length).toBeGreaterThan(0);
    const lo = Date.parse(plan.window.start ?? '');
    const hi = Date.parse(plan.window.end ?? '');
    let prev = -Infinity;
    for (const m of plan.suggestedMinutes) {
      const t = Date.parse(m.time);
      expect(t).toBeGreaterThanOrEqual(lo);
      expect(t).toBeLessThanOrEqual(hi);
      expect(t).toBeGreaterThan(prev);
      prev = t;
    }
  });
  it('key gives what the ambient leaves of a correct exposure (exposures add) [DER]', () => {
    // Ambient on the subject at the background's level: bias -1 (default) less any shortfall.
    // Light adds, so the key alone must give 1 - 2^(bias - shortfall) of a correct exposure,
    // which at the same aperture takes that fraction of the power a full exposure would.
    for (const m of plan.suggestedMinutes) {
      const ambient = 2 ** (-1 - m.background.shortfallStops);
      const fullExposure = computeFlash({
        guideNumber: 40,
        distance: 2,
        aperture: m.background.aperture,
        iso: m.background.iso,
        modifierLossStops: 1.25,
        gelLossStops: plan.gels.gelLossStops,
      });
      expect(m.keyFlash.powerFraction / fullExposure.powerFraction).toBeCloseTo(1 - ambient, 4);
    }
  });
  it('gels the flash for the cooled white balance with warming gels only', () => {
    // 3800 K camera, 5500 K flash: the flash must warm by 1e6/3800 - 1e6/5500 = 81.3 mireds [DER].
    expect(plan.whiteBalance.cameraKelvin).toBe(3800);
    expect(plan.gels.gels.length).toBeGreaterThan(0);
    expect(plan.gels.gels.every((g) => g.miredShift > 0)).toBe(true);
    const achieved = plan.gels.gels.reduce((a, g) => a + g.miredShift, 0);
    expect(plan.gels.residualMired).toBeCloseTo(achieved - (1e6 / 3800 - 1e6 / 5500), 1);
    expect(plan.gels.powerCompensationStops).toBeCloseTo(
      plan.gels.gels.reduce((a, g) => a + g.lossStops, 0),
      6,
    );
  });
  it('default key at 60° gives a dramatic shadow side; ambient one stop under -> 2:1 [DER]', () => {
    // Lit side = key + ambient = a correct exposure; shadow side = ambient alone, one stop under
    // when the background has no shortfall: 1 : 0.5.
    expect(plan.key.shadowSide).toBe('dramatic');
    const first = plan.suggestedMinutes[0];
    const ambient = 2 ** (-1 - (first?.background.shortfallStops ?? 0));
    expect(plan.key.lightingRatio).toBeCloseTo(1 / ambient, 1);
  });
  it('rim one stop over the lit side takes twice the power of a correct exposure [DER]', () => {
    const m = plan.suggestedMinutes[0];
    const rimAlone = computeFlash({
      guideNumber: 30,
      distance: plan.backlight?.distanceToHead ?? 0,
      aperture: m?.background.aperture ?? 0,
      iso: m?.background.iso,
      gelLossStops: plan.gels.gelLossStops,
    });
    expect(m?.rimFlash?.powerFraction).toBeCloseTo(2 * rimAlone.powerFraction, 6);
  });
  it('on a tripod, minutes slower than 1/15 s are not usable (ghosting; common practice, no source)', () => {
    const tripod = planDuskSetup({
      ...input,
      camera: { ...input.camera, support: 'tripod' },
      stepMinutes: 1,
    } as never);
    const slow = tripod.suggestedMinutes.filter(
      (m) => m.background.shutterSeconds > (1 / 15) * 1.001, // shutter times are rounded
    );
    for (const m of slow) expect(m.usable).toBe(false);
    for (const m of tripod.suggestedMinutes.filter((x) => x.usable))
      expect(m.background.shutterSeconds).toBeLessThanOrEqual((1 / 15) * 1.001);
    expect(tripod.window.usableEnd).not.toBeNull();
  });
  it('with no usable minute because the key is too strong, says when and what would free it', () => {
    // A strong key close in on a tripod at f/2.8: the background fits early in the window, but
    // the key would need less than its lowest power (1/256). The warning names the first minute
    // whose background fits and the key's own fixes there (ISO 1230 relation, flash.test.ts).
    const base = {
      ...input,
      camera: { aperture: 2.8, isoMax: 6400, support: 'tripod' as const },
      rim: undefined,
      stepMinutes: 1,
    };
    const strong = planDuskSetup({
      ...base,
      key: { guideNumber: 60, distance: 1, modifierLossStops: 0 },
    } as never);
    expect(strong.window.usableStart).toBeNull();
    const w = strong.warnings.find((x) => x.code === 'no-usable-minute')!;
    expect(w.message).toMatch(
      /At \d\d:\d\d the background fits, but the key needs [\d.]+ stops? less/,
    );
    const back = Number(w.message.match(/move it back to ([\d.]+) m/)?.[1]);
    const nd = Number(w.message.match(/add ([\d.]+) stops? of ND or diffusion/)?.[1]);
    expect(back).toBeGreaterThan(1);
    expect(nd).toBeGreaterThan(0);
    // Each fix, taken as given, frees at least one minute of the same evening.
    for (const key of [
      { guideNumber: 60, distance: back, modifierLossStops: 0 },
      { guideNumber: 60, distance: 1, modifierLossStops: nd },
    ]) {
      const freed = planDuskSetup({ ...base, key } as never);
      expect({ key, usableStart: freed.window.usableStart }).not.toEqual({
        key,
        usableStart: null,
      });
      expect(freed.warnings.map((x) => x.code)).not.toContain('no-usable-minute');
    }
  });
  it('warns when the ambient alone almost exposes the subject', () => {
    const bright = planDuskSetup({ ...input, camera: { ...input.camera, biasStops: 0 } });
    const m = bright.suggestedMinutes.find((x) => x.background.shortfallStops === 0);
    expect(m?.keyFlash.warnings.map((w) => w.code)).toContain('ambient-dominates');
    expect(bright.warnings.map((w) => w.code)).toContain('ambient-dominates');
    expect(plan.warnings.map((w) => w.code)).not.toContain('ambient-dominates');
  });
  it('background 30 m away from a key at 2 m falls off 2 log2(15) stops', () => {
    expect(plan.backgroundFalloffStops).toBeCloseTo(2 * Math.log2(15), 2);
  });
  it('carries the cautions that apply, each deferring to local codes and venue rules', () => {
    const ids = plan.cautions.map((c) => c.id);
    for (const id of ['stands-wind', 'roads-at-night', 'cold-fog-haze', 'batteries'])
      expect(ids).toContain(id);
    expect(ids).not.toContain('water-at-night');
    for (const c of plan.cautions) expect(c.text).toMatch(/local codes, venue rules/);
    expect(plan.cautions.find((c) => c.id === 'stands-wind')?.text).toMatch(/strike/);
    expect(plan.cautions.find((c) => c.id === 'cold-fog-haze')?.text).toMatch(/frostbite/);
    // Lists that state the deference once show each caution's advice without it.
    for (const c of plan.cautions) {
      expect(`${cautionAdvice(c)} ${CAUTION_DEFERENCE}`).toBe(c.text);
      expect(cautionAdvice(c)).not.toMatch(/local codes/);
    }
  });
  it('shows the look as swatches, including the rim bare and gelled', () => {
    const ids = plan.look.map((s) => s.id);
    expect(ids).toEqual(
      expect.arrayContaining(['sky-blue-hour', 'tungsten-window', 'rim-light', 'rim-light-bare']),
    );
    for (const s of plan.look) expect(s.hex).toMatch(/^#[0-9a-f]{6}$/);
  });
  it('polar day: no sunset, says so instead of inventing a window', () => {
    const p = planDuskSetup({
      ...input,
      latitude: 78.22,
      longitude: 15.63,
      date: '2026-06-21',
      timeZone: 'Arctic/Longyearbyen',
    });
    expect(p.twilight.sunset).toBeNull();
    expect(p.warnings.map((w) => w.code)).toContain('no-sunset');
  });

  it('polar night: plans without throwing, leaving out the minutes too dark to expose', () => {
    const night = { ...input, latitude: 78.22, longitude: 15.63, date: '2026-12-15' };
    // Reference library (suncalc): the sun stays far below the horizon all day there.
    const noon = getPosition(new Date('2026-12-15T11:00:00Z'), 78.22, 15.63);
    expect((noon.altitude * 180) / Math.PI).toBeLessThan(-10);
    const p = planDuskSetup({ ...night, timeZone: 'Arctic/Longyearbyen' });
    expect(p.window.start).toBeNull();
    const codes = p.warnings.map((w) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['no-sunset', 'too-dark']));
    // What is left is the midday glow, within the background solver's EV100 range (-10..25).
    for (const m of p.suggestedMinutes) expect(m.ambientEv100).toBeGreaterThanOrEqual(-10);
    expect(JSON.parse(JSON.stringify(p))).toEqual(p);
  });
});

describe('planDuskSetup names fields as its input does', () => {
  // Field paths are the caller's: the balance solver's own names must not leak out.
  const base = {
    latitude: 54.21,
    longitude: -2.47,
    date: '2026-09-12',
    timeZone: 'Europe/London',
    key: { guideNumber: 40, distance: 3 },
  };
  const fieldOf = (input: unknown) => {
    try {
      planDuskSetup(input as never);
    } catch (e) {
      return (e as { field?: string }).field;
    }
    return undefined;
  };
  it('camera.tint, not cameraTint', () => {
    expect(fieldOf({ ...base, camera: { tint: 99 } })).toBe('camera.tint');
  });
  it('rim.rimOverKeyStops, not rim.exposureStops, even on a polar night with no minute', () => {
    const rim = { guideNumber: 40, distanceBehind: 2.5, lightHeight: 1.2, rimOverKeyStops: 9 };
    expect(fieldOf({ ...base, rim })).toBe('rim.rimOverKeyStops');
    // 78° N in December: the sun stays far below the horizon all day (polar night).
    expect(fieldOf({ ...base, latitude: 78.2, longitude: 15.6, date: '2026-12-15', rim })).toBe(
      'rim.rimOverKeyStops',
    );
  });
  it('checks the key, rim and camera on a polar night too, though no minute is planned', () => {
    // 89.5° N at the December solstice: the sun stays near -23°, so every minute is too dark and
    // none is planned (suncalc confirms the altitude below).
    const polar = { ...base, latitude: 89.5, longitude: 0, date: '2026-12-21' };
    expect(getPosition(new Date('2026-12-21T12:00:00Z'), 89.5, 0).altitude).toBeLessThan(
      (-20 * Math.PI) / 180,
    );
    expect(planDuskSetup(polar as never).suggestedMinutes).toHaveLength(0);
    expect(fieldOf(polar)).toBeUndefined();
    expect(fieldOf({ ...polar, key: { guideNumber: 9999, distance: 3 } })).toBe('key.guideNumber');
    expect(fieldOf({ ...polar, camera: { isoMax: 1 } })).toBe('camera.isoMax');
    expect(
      fieldOf({
        ...polar,
        rim: { guideNumber: 40, distanceBehind: 2.5, lightHeight: 1.2, modifierLossStops: 20 },
      }),
    ).toBe('rim.modifierLossStops');
  });
});
