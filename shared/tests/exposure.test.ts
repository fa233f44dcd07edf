import { describe, expect, it } from 'vitest';
import {
  APERTURE_SCALE,
  ISO_SCALE,
  SHUTTER_SCALE,
  apertureValue,
  ev100FromSettings,
  evFromSettings,
  nearestStop,
  solveBackgroundExposure,
  solveExposure,
  speedValue,
  timeValue,
} from '../src/index.js';

describe('APEX constants (ASA PH2.5-1960; Kerr 2007)', () => {
  it('Sv(ISO 100) = 5, Av(f/1.4) ~ 1, Tv(1/128 s) = 7', () => {
    expect(speedValue(100)).toBeCloseTo(5, 12);
    expect(apertureValue(Math.SQRT2)).toBeCloseTo(1, 12);
    expect(timeValue(1 / 128)).toBeCloseTo(7, 12);
  });
  it('EV = log2(N^2/t): f/8 at 1/128 s is EV 13', () => {
    expect(evFromSettings(8, 1 / 128)).toBeCloseTo(13, 12);
  });
  it('Sunny 16 (common practice, no source): f/16 at 1/100 s ISO 100 is EV100 14.64', () => {
    expect(ev100FromSettings(16, 1 / 100, 100)).toBeCloseTo(14.64, 2);
  });
  it('EV at ISO S = EV100 + log2(S/100)', () => {
    expect(ev100FromSettings(8, 1 / 128, 400)).toBeCloseTo(11, 12);
  });
});

describe('third-stop scales', () => {
  it('f/5.6 is 2^2.5 = 5.657 within 0.05 EV (REFERENCES)', () => {
    const s = APERTURE_SCALE.find((x) => x.label === 'f/5.6');
    expect(s?.value).toBeCloseTo(5.657, 3);
    expect(Math.abs(2 * Math.log2((s?.value ?? 0) / 5.6))).toBeLessThan(0.05);
  });
  it('"1/60" stands for 2^-6 s (REFERENCES)', () => {
    expect(SHUTTER_SCALE.find((x) => x.label === '1/60')?.value).toBeCloseTo(1 / 64, 12);
  });
  it('every nominal marking rounds back to its own exact third-stop value (nominal rounding stays within half a step)', () => {
    for (const scale of [APERTURE_SCALE, SHUTTER_SCALE, ISO_SCALE]) {
      for (const s of scale) expect(nearestStop(scale, s.nominal).label).toBe(s.label);
    }
  });
  it('steps are exactly one third of a stop', () => {
    for (const scale of [SHUTTER_SCALE, ISO_SCALE]) {
      for (let i = 1; i < scale.length; i++) {
        const step = Math.abs(Math.log2((scale[i]?.value ?? 0) / (scale[i - 1]?.value ?? 1)));
        expect(step).toBeCloseTo(1 / 3, 9);
      }
    }
    expect(nearestStop(ISO_SCALE, 3000).label).toBe('ISO 3200');
  });
  it('labels every ISO the API takes with its own mark, past 102400 too', () => {
    // ISO 12232 / ISO 5800 arithmetic speed series (third stops), from memory: ... 102400, 128000,
    // 160000, 204800, ..., 409600 above, and 3, 4, 5, 6, 8, 10, 12, 16, 20, 25, 32, 40 below 50.
    expect(solveExposure({ ev100: 0, aperture: 2, iso: 409600 }).isoLabel).toBe('ISO 409600');
    expect(solveExposure({ ev100: 0, aperture: 2, iso: 204800 }).isoLabel).toBe('ISO 204800');
    expect(solveExposure({ ev100: 15, aperture: 8, iso: 25 }).isoLabel).toBe('ISO 25');
    expect(solveExposure({ ev100: 15, aperture: 8, iso: 3 }).isoLabel).toBe('ISO 3');
    // Each mark is 100 * 2^(k/3) within the series' rounding (under 1/6 stop).
    for (const s of ISO_SCALE) expect(Math.abs(Math.log2(s.nominal / s.value))).toBeLessThan(1 / 6);
    const warned = solveExposure({ ev100: 0, aperture: 2, iso: 204800 }).warnings.map(
      (w) => w.code,
    );
    expect(warned).toContain('iso-off-scale');
  });
});

describe('solveExposure', () => {
  it('simple case {ev100, aperture, iso} solves the shutter: EV100 15, f/16, ISO 100 -> 1/128 s, "1/125"', () => {
    const r = solveExposure({ ev100: 15, aperture: 16, iso: 100 });
    expect(r.shutterSeconds).toBeCloseTo(256 / 2 ** 15, 9); // t = N^2 / 2^EV [STD APEX]
    expect(r.shutterLabel).toBe('1/125');
    expect(r.solvedFor).toBe('shutterSeconds');
  });
  it('solves aperture and ISO too', () => {
    expect(solveExposure({ ev100: 12, shutterSeconds: 1 / 256, iso: 400 }).apertureLabel).toBe(
      'f/8',
    );
    expect(solveExposure({ ev100: 10, aperture: 8, shutterSeconds: 1 / 16 }).iso).toBeCloseTo(
      100 * 2 ** (10 - 10),
      6,
    );
    // f/4 at 1/60 is EV log2(16 * 60) = 9.907 [STD APEX]; a scene of EV100 10 needs ISO
    // 100 * 2^(9.907 - 10) = 93.75 (Sv = Av + Tv - Bv).
    const iso = solveExposure({ ev100: 10, aperture: 4, shutterSeconds: 1 / 60 }).iso;
    expect(Math.abs(iso - 100 * 2 ** (Math.log2(16 * 60) - 10))).toBeLessThanOrEqual(0.05 + 1e-9); // ISO given to 0.1
  });
  it('labels f-numbers below f/1 in hundredths, as lenses mark them (from memory)', () => {
    expect(solveExposure({ ev100: 2, aperture: 0.95, iso: 100 }).apertureLabel).toBe('f/0.95');
  });
  it('all three given: reports how far off the metered exposure they are', () => {
    const r = solveExposure({ ev100: 13, aperture: 8, shutterSeconds: 1 / 64, iso: 100 });
    expect(r.warnings.map((w) => w.code)).toContain('overexposed');
    // f/8 at 1/64 is EV log2(64 * 64) = 12 [STD APEX]: one stop more light than EV 13 wants.
  });
});

describe('solveBackgroundExposure', () => {
  // Expected values from the APEX relation N^2/t = 2^(EV100 + log2(S/100)) [STD], written out.
  const shutter = (ev100: number, n: number, iso: number) =>
    (n * n) / 2 ** (ev100 + Math.log2(iso / 100));
  it('raises ISO only as far as the hand-held limit needs', () => {
    const r = solveBackgroundExposure({ ev100: 6, aperture: 5.6, slowestHandheldSeconds: 1 / 60 });
    expect(r.shutterSeconds).toBeCloseTo(1 / 60, 6);
    expect(r.iso).toBeCloseTo(100 * 2 ** (Math.log2((5.6 * 5.6) / (1 / 60)) - 6), 0);
    expect(r.needsTripod).toBe(false);
  });
  it('past the ISO ceiling the shutter lengthens and a tripod is flagged', () => {
    const r = solveBackgroundExposure({ ev100: 2, aperture: 5.6, isoMax: 6400 });
    expect(r.iso).toBe(6400);
    expect(r.shutterSeconds).toBeCloseTo(shutter(2, 5.6, 6400), 6);
    expect(r.needsTripod).toBe(true);
    expect(r.warnings.map((w) => w.code)).toContain('needs-tripod');
  });
  it('bright ambient exceeds sync: warns, with the HSS loss and ND strength', () => {
    const r = solveBackgroundExposure({ ev100: 14, aperture: 5.6, flashSyncSeconds: 1 / 200 });
    const t = shutter(14, 5.6, 100);
    expect(r.exceedsSync).toBe(true);
    expect(r.ndStopsForSync).toBeCloseTo(Math.log2(1 / 200 / t), 2);
    // HSS: about 1 stop entry loss plus one stop per stop of shutter past sync (common practice, no source)
    expect(r.hssLossStops).toBeCloseTo(1 + Math.log2(1 / 200 / t), 2);
    expect(r.warnings.map((w) => w.code)).toContain('exceeds-sync');
  });
  it('biasStops darkens or brightens the background by that many stops', () => {
    const a = solveBackgroundExposure({ ev100: 8, aperture: 4, iso: 400 });
    const b = solveBackgroundExposure({ ev100: 8, aperture: 4, iso: 400, biasStops: -1 });
    expect(Math.log2(a.shutterSeconds / b.shutterSeconds)).toBeCloseTo(1, 3);
  });
  it('ISO fixed: starts at sync and solves aperture', () => {
    const r = solveBackgroundExposure({ ev100: 10, iso: 100, flashSyncSeconds: 1 / 250 });
    expect(r.shutterSeconds).toBeCloseTo(1 / 250, 6);
    expect(r.aperture).toBeCloseTo(Math.sqrt((1 / 250) * 2 ** 10), 2);
  });
  it('can take place + time instead of ev100', () => {
    const r = solveBackgroundExposure({
      place: { latitude: 40.7, longitude: -74, time: '2026-06-21T20:50:00-04:00' },
      aperture: 4,
    });
    expect(r.ambientSource).toBe('place');
    expect(Number.isFinite(r.ev100)).toBe(true);
  });
});

describe("solveBackgroundExposure keeps inside the caller's own bounds", () => {
  it('an apertureMin above the default ceiling (f/22) is honoured', () => {
    const r = solveBackgroundExposure({ ev100: 14, iso: 100, apertureMin: 32 });
    expect(r.aperture).toBeGreaterThanOrEqual(32);
  });
  it('refuses ambiguous input by name: ev100 with place, or a shutter time to solve for', () => {
    const place = { latitude: 51.5, longitude: 0, time: '2026-09-20T18:30:00Z' };
    expect(() => solveBackgroundExposure({ ev100: 5, place } as never)).toThrow(/place/);
    expect(() => solveBackgroundExposure({ ev100: 5, shutterSeconds: 1 / 60 } as never)).toThrow(
      /shutterSeconds/,
    );
  });
  it('an isoMin above the default ceiling (ISO 6400) is honoured', () => {
    const r = solveBackgroundExposure({ ev100: -2, aperture: 5.6, isoMin: 12800 });
    expect(r.iso).toBeGreaterThanOrEqual(12800);
  });
});
