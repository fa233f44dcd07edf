import { describe, expect, it } from 'vitest';
import {
  countOf,
  clockIn,
  clockOf,
  LightingInputError,
  ambientAt,
  cctFromXy,
  computeBacklight,
  computeFalloff,
  computeFlash,
  computeKeyLight,
  computeTwilight,
  guideNumberFromMeter,
  planDuskSetup,
  solveBackgroundExposure,
  solveBalance,
  solveExposure,
} from '../src/index.js';

const base = { latitude: 51.5, longitude: -0.12, date: '2026-06-21', timeZone: 'Europe/London' };

function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(LightingInputError);
    expect(e).toBeInstanceOf(Error);
    expect((e as LightingInputError).code).toBe('invalid_input');
    expect((e as LightingInputError).reason.length).toBeGreaterThan(0);
    return (e as LightingInputError).field;
  }
  throw new Error('did not throw');
}

describe('every exported function rejects bad input with LightingInputError naming the field', () => {
  const cases: Array<[string, () => unknown, string]> = [
    ['latitude out of range', () => computeTwilight({ ...base, latitude: 91 }), 'latitude'],
    ['longitude NaN', () => computeTwilight({ ...base, longitude: NaN }), 'longitude'],
    [
      'unknown time zone',
      () => computeTwilight({ ...base, timeZone: 'Mars/Olympus_Mons' }),
      'timeZone',
    ],
    ['impossible date', () => computeTwilight({ ...base, date: '2026-02-30' }), 'date'],
    ['date format', () => computeTwilight({ ...base, date: '21/06/2026' }), 'date'],
    [
      'band order',
      () => computeTwilight({ ...base, blueHour: { upperDeg: -8, lowerDeg: -4 } }),
      'blueHour.lowerDeg',
    ],
    ['sky', () => computeTwilight({ ...base, sky: 'foggy' as never }), 'sky'],
    ['step', () => computeTwilight({ ...base, stepMinutes: 0 }), 'stepMinutes'],
    [
      'ambientAt time',
      () => ambientAt({ latitude: 0, longitude: 0, time: '2026-06-21 20:00' }),
      'time',
    ],
    ['ev100 Infinity', () => solveExposure({ ev100: Infinity, aperture: 8 }), 'ev100'],
    ['negative aperture', () => solveExposure({ ev100: 10, aperture: -2 }), 'aperture'],
    ['background needs ev100 or place', () => solveBackgroundExposure({}), 'ev100'],
    [
      'background place field',
      () =>
        solveBackgroundExposure({
          place: { latitude: 100, longitude: 0, time: '2026-06-21T20:00:00Z' },
        }),
      'place.latitude',
    ],
    [
      'flash distance',
      () => computeFlash({ guideNumber: 32, distance: -1, aperture: 8 }),
      'distance',
    ],
    [
      'flash unit',
      () =>
        computeFlash({ guideNumber: 32, guideNumberUnit: 'yd' as never, distance: 1, aperture: 8 }),
      'guideNumberUnit',
    ],
    ['meter aperture', () => guideNumberFromMeter({ aperture: 0, distance: 2 }), 'aperture'],
    ['falloff', () => computeFalloff({ subjectDistance: 0 }), 'subjectDistance'],
    ['backlight', () => computeBacklight({ lightHeight: -1, distanceBehind: 2 }), 'lightHeight'],
    [
      'key light',
      () => computeKeyLight({ angleFromCameraDeg: 200, distance: 1, modifierSize: 1 }),
      'angleFromCameraDeg',
    ],
    ['balance kelvin', () => solveBalance({ cameraKelvin: 100 }), 'cameraKelvin'],
    [
      'gel field path',
      () =>
        solveBalance({
          cameraKelvin: 3200,
          gels: [
            { name: 'a', miredShift: 1, lossStops: 0 },
            { name: 'b', miredShift: 1, lossStops: 0 },
            { name: 'c', miredShift: NaN, lossStops: 0 },
          ],
        }),
      'gels[2].miredShift',
    ],
    ['cct y', () => cctFromXy(0.3, 0), 'y'],
    ['setup key missing', () => planDuskSetup({ ...base } as never), 'key'],
    [
      'setup nested key',
      () => planDuskSetup({ ...base, key: { guideNumber: 0, distance: 2 } }),
      'key.guideNumber',
    ],
    [
      'setup nested rim',
      () =>
        planDuskSetup({
          ...base,
          key: { guideNumber: 40, distance: 2 },
          rim: { guideNumber: 30, distanceBehind: 1.8, lightHeight: -3 },
        }),
      'rim.lightHeight',
    ],
    ['not an object', () => computeFlash(null as never), 'input'],
  ];
  for (const [name, fn, field] of cases) {
    it(name, () => expect(fieldOf(fn)).toBe(field));
  }
});

describe('clockOf / clockIn', () => {
  it('rounds to the nearest minute, 24-hour, across midnight', () => {
    expect(clockOf('2026-06-20T20:11:29+02:00')).toBe('20:11');
    expect(clockOf('2026-06-20T20:11:30+02:00')).toBe('20:12');
    expect(clockOf('2026-06-20T23:59:45+02:00')).toBe('00:00');
    expect(clockOf('2026-06-20T07:05+02:00')).toBe('07:05');
  });

  it('agrees with the platform Intl time-zone database for instants seen in a zone', () => {
    // Reference: ECMA-402 Intl.DateTimeFormat with the IANA tz database (independent of our
    // offset code), on the instant moved on by 30 s and cut to the minute: the same rounding.
    const zones = ['Europe/London', 'America/Sao_Paulo', 'Asia/Kolkata', 'Australia/Lord_Howe'];
    const reference = (ms: number, timeZone: string) =>
      new Intl.DateTimeFormat('en-GB', {
        hour: '2-digit',
        minute: '2-digit',
        hourCycle: 'h23',
        timeZone,
      }).format(new Date(ms + 30_000));
    for (const timeZone of zones) {
      for (let ms = Date.UTC(2026, 2, 28, 0, 0, 17); ms < Date.UTC(2026, 3, 6); ms += 3_599_911) {
        const iso = new Date(ms).toISOString();
        expect(clockIn(iso, timeZone)).toBe(reference(ms, timeZone));
      }
    }
  });
});

describe('countOf', () => {
  it('is singular only for exactly one (English grammar)', () => {
    expect(countOf(1, 'stop')).toBe('1 stop');
    expect(countOf(-1, 'step')).toBe('-1 step');
    expect(countOf(1.5, 'stop')).toBe('1.5 stops');
    expect(countOf(0, 'stop')).toBe('0 stops');
  });
});
