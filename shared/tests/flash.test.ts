import { describe, expect, it } from 'vitest';
import {
  computeBacklight,
  computeFalloff,
  computeFlash,
  computeFlashAperture,
  computeKeyLight,
  decimalScale,
  LightingInputError,
  LIGHT_DISTANCE_RANGE,
  MODIFIER_SIZE_RANGE,
  LOWEST_CAMERA_ISO,
  fractionLabel,
  guideNumberFromMeter,
  stopsBetween,
} from '../src/index.js';

describe('guide numbers (ISO 1230: GN = distance x f-number at ISO 100)', () => {
  it('GN 32 m at 4 m -> f/8 at full power [DER]', () => {
    const r = computeFlash({
      guideNumber: 32,
      guideNumberUnit: 'm',
      distance: 4,
      distanceUnit: 'm',
      aperture: 8,
      iso: 100,
    });
    expect(r.powerFraction).toBeCloseTo(1, 9);
    expect(r.powerLabel).toBe('1/1');
    expect(r.feasible).toBe(true);
    expect(r.requiredGuideNumber).toBeCloseTo(32, 6);
  });
  it('GN 80 ft at 20 ft -> f/4; at f/8 -> 10 ft [DER]', () => {
    expect(
      computeFlashAperture({
        guideNumber: 80,
        guideNumberUnit: 'ft',
        distance: 20,
        distanceUnit: 'ft',
        powerFraction: 1,
      }).aperture,
    ).toBeCloseTo(4, 6);
    const r = computeFlash({
      guideNumber: 80,
      guideNumberUnit: 'ft',
      distance: 10,
      distanceUnit: 'ft',
      aperture: 8,
    });
    expect(r.powerFraction).toBeCloseTo(1, 9);
  });
  it('mixed units: GN 80 ft is 24.38 m (1 ft = 0.3048 m exactly)', () => {
    const r = computeFlash({
      guideNumber: 80,
      guideNumberUnit: 'ft',
      distance: 3.048,
      distanceUnit: 'm',
      aperture: 8,
    });
    expect(r.powerFraction).toBeCloseTo(1, 9);
  });
  it('each halving of power is one stop: f/4 at 4 m with GN 32 needs 1/4', () => {
    const r = computeFlash({ guideNumber: 32, distance: 4, aperture: 4 });
    expect(r.powerFraction).toBeCloseTo(0.25, 9);
    expect(r.stopsBelowFull).toBeCloseTo(2, 9);
    expect(r.powerLabel).toBe('1/4');
    expect(r.decimalPower).toBe(8);
  });
  it('GN scales with sqrt(ISO/100): ISO 400 doubles reach', () => {
    expect(
      computeFlash({ guideNumber: 32, distance: 8, aperture: 8, iso: 400 }).powerFraction,
    ).toBeCloseTo(1, 9);
  });
  it('losses in stops are applied: 1 stop of modifier needs twice the power', () => {
    const r = computeFlash({ guideNumber: 32, distance: 4, aperture: 8, modifierLossStops: 1 });
    expect(r.powerFraction).toBeCloseTo(2, 9);
    expect(r.feasible).toBe(false);
    // Rounded toward enough: down to the hundredth for distance and f-number [DER].
    expect(r.fixes?.moveCloserTo).toBe(Math.floor((100 * 4) / Math.SQRT2) / 100);
    expect(r.fixes?.raiseIsoTo).toBe(200);
    expect(r.fixes?.openUpTo).toBe(Math.floor((100 * 8) / Math.SQRT2) / 100);
    const base = { guideNumber: 32, distance: 4, aperture: 8, modifierLossStops: 1 };
    for (const fixed of [
      computeFlash({ ...base, distance: r.fixes!.moveCloserTo! }),
      computeFlash({ ...base, aperture: r.fixes!.openUpTo! }),
      computeFlash({ ...base, iso: r.fixes!.raiseIsoTo! }),
    ]) {
      expect(fixed.feasible).toBe(true);
      expect(fixed.powerFraction).toBeGreaterThan(0.99);
    }
  });
  it('gel loss adds to modifier loss', () => {
    const r = computeFlash({
      guideNumber: 32,
      distance: 4,
      aperture: 4,
      modifierLossStops: 0.5,
      gelLossStops: 0.5,
    });
    expect(r.powerFraction).toBeCloseTo(0.5, 9);
  });
  it('GN from a meter reading: f/11 at 3 m, full power, ISO 100 -> GN 33 m', () => {
    const r = guideNumberFromMeter({ aperture: 11, distance: 3 });
    expect(r.guideNumberM).toBeCloseTo(33, 6);
    expect(r.guideNumberFt).toBeCloseTo(33 / 0.3048, 1);
    expect(
      guideNumberFromMeter({ aperture: 8, distance: 2, powerFraction: 0.25, iso: 400 })
        .guideNumberM,
    ).toBeCloseTo(16, 6);
  });
});

describe('power labels', () => {
  const third = 2 ** (1 / 3); // a third-stop step is 2^(1/3) [DER]
  it('third-stop fraction labels', () => {
    expect(fractionLabel(1 / 8)).toBe('1/8');
    expect(fractionLabel((1 / 8) * third)).toBe('1/8 +0.3');
    expect(fractionLabel((1 / 8) * third * third)).toBe('1/8 +0.7');
    expect(fractionLabel(1 / 256)).toBe('1/256');
    expect(fractionLabel(1 / 1024)).toBe('below 1/256');
  });
  it('decimal 10-stop scale: full = 10, 1/8 = 7, 1/256 = 2', () => {
    expect(decimalScale(1)).toBe(10);
    expect(decimalScale(1 / 8)).toBe(7);
    expect(decimalScale(1 / 256)).toBe(2);
  });
});

describe('inverse-square falloff (E = I/d^2, photometry handbooks)', () => {
  it('doubling the distance loses 2 stops', () => {
    expect(stopsBetween(1, 2)).toBeCloseTo(2, 12);
    const r = computeFalloff({ subjectDistance: 2, backgroundDistance: 4, groundDistance: 3 });
    expect(r.subjectToBackgroundStops).toBeCloseTo(2, 9);
    expect(r.marks.find((m) => m.id === 'ground')?.stopsRelativeToSubject).toBeCloseTo(
      -2 * Math.log2(1.5),
      3,
    );
    expect(r.series.length).toBe(40);
  });
});

describe('backlight geometry', () => {
  it('head direction is atan(rise / run) [DER]', () => {
    const r = computeBacklight({
      lightHeight: 1,
      headHeight: 1.6,
      distanceBehind: 1.8,
      beamAngleDeg: 20,
    });
    expect(r.headDirectionDeg).toBeCloseTo((Math.atan(0.6 / 1.8) * 180) / Math.PI, 2);
    expect(r.distanceToHead).toBeCloseTo(Math.hypot(0.6, 1.8), 3);
  });
  it('rule of thumb: ~1.8 m (6 ft) behind, gridded, aimed up at the head -> no ground spill (common practice, no source)', () => {
    const r = computeBacklight({ lightHeight: 1.0, distanceBehind: 1.8, beamAngleDeg: 20 });
    expect(r.aimDeg).toBeGreaterThan(0);
    expect(r.groundSpill).toBeNull();
    expect(r.warnings).toEqual([]);
  });
  it('a low bare light far behind lights the ground more than the rim -> warning', () => {
    const r = computeBacklight({ lightHeight: 0.3, distanceBehind: 3 });
    // steepest beam ray -(100/2 - aim); ground/rim = sin^3(dep) * dHead^2 / H^2 [DER]
    const aim = Math.atan2(1.3, 3);
    const dep = 50 * (Math.PI / 180) - aim;
    const expected = Math.log2((Math.sin(dep) ** 3 * (9 + 1.69)) / 0.09);
    expect(r.groundVsRimStops).toBeCloseTo(expected, 1);
    expect(r.warnings.map((w) => w.code)).toContain('ground-outshines-rim');
  });
  it('aimed down from above is flagged (common practice, no source)', () => {
    const r = computeBacklight({ lightHeight: 2.6, distanceBehind: 1.8 });
    expect(r.aimDeg).toBeLessThan(0);
    expect(r.warnings.map((w) => w.code)).toContain('aimed-down');
  });
});

describe('key light', () => {
  it('rule of thumb: 45-90° off the camera axis gives a dramatic shadow side (common practice, no source)', () => {
    for (const a of [45, 60, 90])
      expect(
        computeKeyLight({ angleFromCameraDeg: a, distance: 1.5, modifierSize: 0.9 }).shadowSide,
      ).toBe('dramatic');
    expect(
      computeKeyLight({ angleFromCameraDeg: 5, distance: 1.5, modifierSize: 0.9 }).shadowSide,
    ).toBe('frontal');
  });
  it('apparent size 2 atan(s / 2d): a 1 m source at 1 m subtends 53.13° [DER]', () => {
    const r = computeKeyLight({ angleFromCameraDeg: 45, distance: 1, modifierSize: 1 });
    expect(r.apparentSizeDeg).toBeCloseTo(53.13, 2);
    expect(r.quality).toBe('soft');
    expect(
      computeKeyLight({ angleFromCameraDeg: 45, distance: 5, modifierSize: 0.1 }).quality,
    ).toBe('hard');
  });
  it('lighting ratio (key + fill) : fill (lighting texts, from memory): 1 stop -> 3:1, 2 stops -> 5:1', () => {
    expect(
      computeKeyLight({
        angleFromCameraDeg: 45,
        distance: 1,
        modifierSize: 1,
        keyOverAmbientStops: 1,
      }).lightingRatio,
    ).toBe(3);
    expect(
      computeKeyLight({
        angleFromCameraDeg: 45,
        distance: 1,
        modifierSize: 1,
        keyOverAmbientStops: 2,
      }).lightingRatioLabel,
    ).toBe('5:1');
  });
  it('position: 60° at 2 m with 30° elevation [DER trig]', () => {
    const r = computeKeyLight({
      angleFromCameraDeg: 60,
      distance: 2,
      modifierSize: 1,
      elevationDeg: 30,
    });
    expect(r.position.aboveEyes).toBeCloseTo(1, 3);
    expect(r.position.sideways).toBeCloseTo(2 * Math.cos(Math.PI / 6) * Math.sin(Math.PI / 3), 3);
  });
});

describe('flash below its lowest power (ISO 1230 guide-number relation)', () => {
  it('GN 60 at 1 m, f/2 needs (2 x 1 / 60)^2 = 1/900 of full power: move back or stop down', () => {
    // 1/900 is under 1/256 by 900/256; distance and f-number each scale with the square root
    // [DER]: move back to sqrt(900/256) = 1.875 m, or stop down to f/3.75.
    const r = computeFlash({ guideNumber: 60, distance: 1, aperture: 2 });
    expect(r.feasible).toBe(false);
    expect(r.warnings.map((w) => w.code)).toEqual(['below-min-power']);
    // Fixes are rounded up to the next hundredth (toward enough): within [exact, exact + 0.01].
    const atOrJustAbove = (got: number | undefined, exact: number) => {
      expect(got).toBeGreaterThanOrEqual(exact - 1e-9);
      expect(got).toBeLessThanOrEqual(exact + 0.01);
    };
    atOrJustAbove(r.fixes?.moveBackTo, Math.sqrt(900 / 256));
    atOrJustAbove(r.fixes?.stopDownTo, 2 * Math.sqrt(900 / 256));
    // The same surplus in stops, log2(900/256) = 1.81, of ND or diffusion in front of the flash
    // [DER]. ISO 100 would have to fall to 100 x 256/900 = 28, below any camera: not offered.
    const surplus = Math.log2(900 / 256);
    atOrJustAbove(r.fixes?.stopDownByStops, surplus);
    expect(r.fixes?.lowerIsoTo).toBeUndefined();
    atOrJustAbove(r.fixes?.addLossStops, surplus);
    // Each fix taken as given (rounded toward enough) makes the shot feasible, just above the
    // lowest power.
    const base = { guideNumber: 60, distance: 1, aperture: 2 };
    for (const fixed of [
      computeFlash({ ...base, modifierLossStops: r.fixes!.addLossStops! }),
      computeFlash({ ...base, distance: r.fixes!.moveBackTo! }),
      computeFlash({ ...base, aperture: r.fixes!.stopDownTo! }),
    ]) {
      expect(fixed.feasible).toBe(true);
      expect(fixed.powerFraction).toBeGreaterThanOrEqual(1 / 256);
      expect(fixed.powerFraction).toBeLessThan(1.05 / 256);
    }
  });
  it('offers a lower ISO only while it stays at or above the lowest settable ISO', () => {
    // GN 60 at 0.5 m, f/2.8, ISO 800 (ISO 1230): (2.8 x 0.5 / (60 x sqrt(8)))^2 = 1/14,694 of
    // full power, log2(14694/256) = 5.84 stops under 1/256; ISO 800 / 2^5.84 = 14, below
    // LOWEST_CAMERA_ISO (50): no ISO fix, the others stay.
    const r = computeFlash({ guideNumber: 60, distance: 0.5, aperture: 2.8, iso: 800 });
    expect(r.fixes?.addLossStops).toBeCloseTo(Math.log2(((60 * Math.sqrt(8)) / 1.4) ** 2 / 256), 1);
    expect(r.fixes?.lowerIsoTo).toBeUndefined();
    expect(r.fixes?.lowerIsoByStops).toBeUndefined();
    expect(r.fixes?.moveBackTo).toBeDefined();
    // GN 60 at 1 m, f/3.5, ISO 100: (3.5/60)^2 = 1/294 of full power, 0.2 stops under 1/256;
    // ISO 100 x 256/294 = 87.1 → 87, above 50: offered, and feasible as given.
    const small = computeFlash({ guideNumber: 60, distance: 1, aperture: 3.5 });
    expect(small.fixes?.lowerIsoTo).toBe(Math.floor(100 * (3.5 / 60) ** 2 * 256));
    const fixed = computeFlash({ guideNumber: 60, distance: 1, aperture: 3.5, iso: 87 });
    expect(fixed.feasible).toBe(true);
    expect(LOWEST_CAMERA_ISO).toBe(50);
  });
  it('exposureStops scales the power: -1 stop is half the power [DER]', () => {
    const full = computeFlash({ guideNumber: 40, distance: 3, aperture: 5.6 });
    const half = computeFlash({ guideNumber: 40, distance: 3, aperture: 5.6, exposureStops: -1 });
    expect(half.powerFraction).toBeCloseTo(((5.6 * 3) / 40) ** 2 / 2, 5);
    expect(half.powerFraction / full.powerFraction).toBeCloseTo(0.5, 5);
  });
});

describe('falloff series', () => {
  it('runs outward from `from` even when `from` is past the farthest mark', () => {
    const r = computeFalloff({ subjectDistance: 1, from: 10 });
    const d = r.series.map((p) => p.distance);
    expect(d[0]).toBeCloseTo(10, 6);
    for (let i = 1; i < d.length; i++) expect(d[i]).toBeGreaterThan(d[i - 1] as number);
  });
  it('refuses a series whose end is not beyond its start, naming `to`', () => {
    expect(() => computeFalloff({ subjectDistance: 2, from: 5, to: 5 })).toThrow(
      expect.objectContaining({ field: 'to', reason: 'must be beyond from (5)' }),
    );
    // From at its largest still leaves room for the default end (1000).
    expect(computeFalloff({ subjectDistance: 2, from: 999 }).series.at(-1)?.distance).toBeCloseTo(
      1000,
      6,
    );
  });
});

describe('light distances: the lower limit follows the unit, as the upper one does', () => {
  // 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959): 0.1 m = 0.328 ft and
  // 50 m = 164.04 ft, so 0.33..164 ft lies inside 0.1..50 m.
  const FT = 0.3048;
  it('the feet range converts to within the metre range', () => {
    const { m, ft } = LIGHT_DISTANCE_RANGE;
    expect(ft.min * FT).toBeGreaterThanOrEqual(m.min);
    expect(ft.min * FT).toBeLessThan(m.min + 0.001);
    expect(ft.max * FT).toBeLessThanOrEqual(m.max);
    expect(ft.max * FT).toBeGreaterThan(m.max - 0.02);
  });

  const refusal = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      if (e instanceof LightingInputError) return { field: e.field, message: e.message };
      throw e;
    }
    return null;
  };

  it('key light: 0.1 ft (3 cm) is refused; 0.1 m and 0.33 ft are accepted', () => {
    const key = (distance: number, distanceUnit: 'm' | 'ft') => () =>
      computeKeyLight({ angleFromCameraDeg: 45, distance, distanceUnit, modifierSize: 0.3 });
    expect(refusal(key(0.1, 'ft'))).toMatchObject({ field: 'distance' });
    expect(refusal(key(0.1, 'ft'))?.message).toMatch(/0\.33 and 164/);
    expect(refusal(key(0.33, 'ft'))).toBeNull();
    expect(refusal(key(0.1, 'm'))).toBeNull();
    expect(refusal(key(164, 'ft'))).toBeNull();
    expect(refusal(key(51, 'm'))).toMatchObject({ field: 'distance' });
  });

  it('backlight: distanceBehind 0.1 ft is refused; 0.33 ft and 0.1 m are accepted', () => {
    const rim = (distanceBehind: number, distanceUnit: 'm' | 'ft') => () =>
      computeBacklight({ lightHeight: 1, distanceBehind, distanceUnit });
    expect(refusal(rim(0.1, 'ft'))).toMatchObject({ field: 'distanceBehind' });
    expect(refusal(rim(0.33, 'ft'))).toBeNull();
    expect(refusal(rim(0.1, 'm'))).toBeNull();
  });

  it('backlight: headHeight 0.1 ft is refused; 0.33 ft and 0.1 m are accepted', () => {
    const head = (headHeight: number, distanceUnit: 'm' | 'ft') => () =>
      computeBacklight({ lightHeight: 1, distanceBehind: 2, distanceUnit, headHeight });
    expect(refusal(head(0.1, 'ft'))).toMatchObject({ field: 'headHeight' });
    expect(refusal(head(0.33, 'ft'))).toBeNull();
    expect(refusal(head(0.1, 'm'))).toBeNull();
  });

  it('key light: modifierSize 0.01 ft (3 mm) is refused; 0.033 ft and 0.01 m are accepted', () => {
    const { m, ft } = MODIFIER_SIZE_RANGE;
    // 0.033 ft = 1.006 cm, so the feet range starts just inside the metre one.
    expect(ft.min * FT).toBeGreaterThanOrEqual(m.min);
    expect(ft.min * FT).toBeLessThan(m.min + 0.001);
    const key = (modifierSize: number, distanceUnit: 'm' | 'ft') => () =>
      computeKeyLight({ angleFromCameraDeg: 45, distance: 2, distanceUnit, modifierSize });
    expect(refusal(key(0.01, 'ft'))).toMatchObject({ field: 'modifierSize' });
    expect(refusal(key(0.033, 'ft'))).toBeNull();
    expect(refusal(key(0.01, 'm'))).toBeNull();
    expect(refusal(key(33, 'ft'))).toBeNull();
    expect(refusal(key(11, 'm'))).toMatchObject({ field: 'modifierSize' });
  });
});
