import { getTimes } from 'suncalc';
import { SKY_CONDITIONS, MODEL_UNCERTAINTY_STOPS, type SkyCondition } from './ambient-model.js';
import { findCrossing, geometricAltitudeDeg, sunAzimuthDeg } from './sun-position.js';
import { ambientTimeline, type AmbientPoint } from './timeline.js';
import { LightingInputError } from '../errors.js';
import { round } from '../units/math.js';
import { localToEpoch, requireDate, requireTimeZone, toLocalIso } from '../units/time-zone.js';
import { optionalNumber, requireNumber, requireObject, requireOneOf } from '../units/validate.js';

/** Sun-altitude bounds of a window, degrees of geometric altitude (upper > lower). */
export interface AltitudeBand {
  upperDeg: number;
  lowerDeg: number;
}

export interface TwilightInput {
  /** Degrees, -90..90, north positive. */
  latitude: number;
  /** Degrees, -180..180, east positive. */
  longitude: number;
  /** Local calendar date, YYYY-MM-DD (1900-2100). */
  date: string;
  /** IANA time zone, e.g. `Europe/London`. */
  timeZone: string;
  /** Observer height above the visible horizon, metres, 0..9000 (lowers sunset's horizon). */
  elevation?: number;
  /** Golden-hour bounds; default +6° to -4° (no standard; common practice). */
  goldenHour?: AltitudeBand;
  /** Blue-hour bounds; default -4° to -8° (no standard; common practice). */
  blueHour?: AltitudeBand;
  /** Ambient timeline step, minutes, 0.5..60; default 2. */
  stepMinutes?: number;
  /** Sky condition for the ambient estimate; default clear. */
  sky?: SkyCondition;
}

/** Why an event is null. */
export const MISSING_REASONS = [
  'sun-never-sets',
  'sun-never-rises',
  'twilight-never-ends',
  'twilight-never-begins',
  'sun-always-above',
  'sun-always-below',
] as const;
export type MissingReason = (typeof MISSING_REASONS)[number];

export interface TimeWindow {
  start: string | null;
  end: string | null;
}

export interface TwilightResult {
  date: string;
  timeZone: string;
  sunrise: string | null;
  sunset: string | null;
  civilDawn: string | null;
  civilDusk: string | null;
  nauticalDawn: string | null;
  nauticalDusk: string | null;
  astronomicalDawn: string | null;
  astronomicalDusk: string | null;
  solarNoon: string;
  /** Evening golden hour (sun descending through the band). */
  goldenHour: TimeWindow;
  /** Evening blue hour. */
  blueHour: TimeWindow;
  /** Sun azimuth at sunset, degrees clockwise from north (where the afterglow is); null if none. */
  sunsetAzimuthDeg: number | null;
  /** For each null event (keys like `sunset`, `goldenHour.start`), why it is missing. */
  reasons: Record<string, MissingReason>;
  /** Notes, e.g. an event that falls after local midnight. */
  notes: string[];
  ambient: {
    sky: SkyCondition;
    model: 'USNO Circular 171';
    uncertaintyStops: number;
    stepMinutes: number;
    points: AmbientPoint[];
  };
}

const DEFAULT_GOLDEN: AltitudeBand = { upperDeg: 6, lowerDeg: -4 };
const DEFAULT_BLUE: AltitudeBand = { upperDeg: -4, lowerDeg: -8 };
const HALF_DAY = 12 * 3600_000;

function readBand(field: string, value: unknown, fallback: AltitudeBand): AltitudeBand {
  if (value === undefined || value === null) return fallback;
  const o = requireObject(field, value);
  const range = { min: -18, max: 20 };
  const upperDeg = requireNumber(`${field}.upperDeg`, o.upperDeg, range);
  const lowerDeg = requireNumber(`${field}.lowerDeg`, o.lowerDeg, range);
  if (upperDeg <= lowerDeg) {
    throw new LightingInputError(`${field}.lowerDeg`, 'must be below upperDeg');
  }
  return { upperDeg, lowerDeg };
}

/** Validated, defaulted twilight input. */
export interface TwilightParams {
  latitude: number;
  longitude: number;
  date: string;
  timeZone: string;
  elevation: number;
  golden: AltitudeBand;
  blue: AltitudeBand;
  stepMinutes: number;
  sky: SkyCondition;
  localNoonMs: number;
}

/** Validate a {@link TwilightInput}; throws LightingInputError naming the field. */
export function readTwilightInput(input: unknown): TwilightParams {
  const o = requireObject('input', input);
  const latitude = requireNumber('latitude', o.latitude, { min: -90, max: 90 });
  const longitude = requireNumber('longitude', o.longitude, { min: -180, max: 180 });
  const cal = requireDate('date', o.date);
  const timeZone = requireTimeZone('timeZone', o.timeZone);
  return {
    latitude,
    longitude,
    date: o.date as string,
    timeZone,
    elevation: optionalNumber('elevation', o.elevation, 0, { min: 0, max: 9000 }),
    golden: readBand('goldenHour', o.goldenHour, DEFAULT_GOLDEN),
    blue: readBand('blueHour', o.blueHour, DEFAULT_BLUE),
    stepMinutes: optionalNumber('stepMinutes', o.stepMinutes, 2, { min: 0.5, max: 60 }),
    sky: requireOneOf('sky', o.sky, SKY_CONDITIONS, 'clear'),
    localNoonMs: localToEpoch(cal, 12, timeZone),
  };
}

/** Epoch times of the evening and morning events (null when missing) and the reasons. */
export interface SolarDayEvents {
  noonMs: number;
  events: Record<string, number | null>;
  reasons: Record<string, MissingReason>;
}

const TWILIGHT_NAMES: ReadonlyArray<readonly [string, string, string]> = [
  ['dawn', 'civilDawn', 'civilDusk'],
  ['nauticalDawn', 'nauticalDawn', 'nauticalDusk'],
  ['nightEnd', 'astronomicalDawn', 'astronomicalDusk'],
];
const SUNCALC_EVENING: Record<string, string> = {
  dawn: 'dusk',
  nauticalDawn: 'nauticalDusk',
  nightEnd: 'night',
};

/** Solve the solar day's events (suncalc 2.x for the standard ones, bisection for bands). */
export function solveSolarDay(p: TwilightParams): SolarDayEvents {
  const geo = getTimes(new Date(p.localNoonMs), p.latitude, p.longitude, 0);
  const withDip =
    p.elevation > 0 ? getTimes(new Date(p.localNoonMs), p.latitude, p.longitude, p.elevation) : geo;
  const noonMs = geo.solarNoon.getTime();
  const events: Record<string, number | null> = {};
  const reasons: Record<string, MissingReason> = {};
  const ms = (d: Date | null | undefined | boolean): number | null =>
    d instanceof Date ? d.getTime() : null;

  events.sunrise = ms(withDip.sunrise);
  events.sunset = ms(withDip.sunset);
  if (events.sunset === null) {
    const reason = withDip.alwaysUp ? 'sun-never-sets' : 'sun-never-rises';
    reasons.sunrise = reason;
    reasons.sunset = reason;
  }
  const noonAlt = geometricAltitudeDeg(noonMs, p.latitude, p.longitude);
  for (const [key, morning, evening] of TWILIGHT_NAMES) {
    events[morning] = ms(geo[key]);
    events[evening] = ms(geo[SUNCALC_EVENING[key] ?? '']);
    const threshold = key === 'dawn' ? -6 : key === 'nauticalDawn' ? -12 : -18;
    const reason = noonAlt < threshold ? 'twilight-never-begins' : 'twilight-never-ends';
    if (events[morning] === null) reasons[morning] = reason;
    if (events[evening] === null) reasons[evening] = reason;
  }
  const bands: Array<[string, number]> = [
    ['goldenHour.start', p.golden.upperDeg],
    ['goldenHour.end', p.golden.lowerDeg],
    ['blueHour.start', p.blue.upperDeg],
    ['blueHour.end', p.blue.lowerDeg],
  ];
  for (const [name, deg] of bands) {
    events[name] = findCrossing(deg, noonMs, noonMs + HALF_DAY, p.latitude, p.longitude);
    if (events[name] === null) {
      reasons[name] = noonAlt < deg ? 'sun-always-below' : 'sun-always-above';
    }
  }
  return { noonMs, events, reasons };
}

/**
 * Sun events, evening windows and the ambient-light timeline for one local date.
 * Evening events belong to the evening after the date's solar noon; at high latitudes or in
 * zones far from solar time one may fall after local midnight (the ISO string shows the date,
 * and `notes` says so). Missing events are null with a reason, never a neighbouring day's.
 */
export function computeTwilight(input: TwilightInput): TwilightResult {
  const p = readTwilightInput(input);
  const { noonMs, events, reasons } = solveSolarDay(p);
  const iso = (t: number | null | undefined): string | null =>
    t === null || t === undefined ? null : toLocalIso(t, p.timeZone);
  const notes: string[] = [];
  for (const [name, t] of Object.entries(events)) {
    const s = iso(t);
    if (s && s.slice(0, 10) !== p.date) notes.push(`${name} falls on ${s.slice(0, 10)} local time`);
  }
  const start = events['goldenHour.start'] ?? noonMs;
  const end = events.astronomicalDusk ?? noonMs + HALF_DAY;
  const timeline = ambientTimeline(
    p.latitude,
    p.longitude,
    start,
    Math.max(start, end),
    p.stepMinutes,
    p.sky,
    p.timeZone,
  );
  const sunset = events.sunset ?? null;
  return {
    date: p.date,
    timeZone: p.timeZone,
    sunrise: iso(events.sunrise),
    sunset: iso(sunset),
    civilDawn: iso(events.civilDawn),
    civilDusk: iso(events.civilDusk),
    nauticalDawn: iso(events.nauticalDawn),
    nauticalDusk: iso(events.nauticalDusk),
    astronomicalDawn: iso(events.astronomicalDawn),
    astronomicalDusk: iso(events.astronomicalDusk),
    solarNoon: toLocalIso(noonMs, p.timeZone),
    goldenHour: { start: iso(events['goldenHour.start']), end: iso(events['goldenHour.end']) },
    blueHour: { start: iso(events['blueHour.start']), end: iso(events['blueHour.end']) },
    sunsetAzimuthDeg:
      sunset === null ? null : round(sunAzimuthDeg(sunset, p.latitude, p.longitude), 2),
    reasons,
    notes,
    ambient: {
      sky: p.sky,
      model: 'USNO Circular 171',
      uncertaintyStops: MODEL_UNCERTAINTY_STOPS[p.sky],
      stepMinutes: p.stepMinutes,
      points: timeline.points,
    },
  };
}
