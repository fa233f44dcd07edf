import { getTimes } from 'suncalc';
import { SKY_CONDITIONS, MODEL_UNCERTAINTY_STOPS, type SkyCondition } from './ambient-model.js';
import { findCrossing, geometricAltitudeDeg, sunAzimuthDeg } from './sun-position.js';
import { ambientTimeline, type AmbientPoint } from './timeline.js';
import { LightingInputError } from '../errors.js';
import { round } from '../units/math.js';
import { requireLengthUnit, toMetres, type LengthUnit } from '../units/length.js';
import {
  clockOf,
  localToEpoch,
  offsetMinutes,
  requireDate,
  requireTimeZone,
  toLocalIso,
} from '../units/time-zone.js';
import { optionalNumber, requireNumber, requireObject, requireOneOf } from '../units/validate.js';
import type { CodedWarning, TwilightWarningCode } from '../warning-codes.js';

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
  /**
   * Observer height above the visible horizon, in `elevationUnit`: 0..9000 m or 0..29,527 ft
   * (lowers sunset's horizon).
   */
  elevation?: number;
  /** Unit of `elevation`; default metres. */
  elevationUnit?: LengthUnit;
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
  /**
   * Things to check, as a stable code and a sentence. `time-zone-mismatch`: the zone's UTC offset
   * on the date is more than {@link ZONE_SOLAR_MISMATCH_HOURS} h from the place's solar time
   * (longitude / 15 h), so the zone is probably not the place's.
   */
  warnings: CodedWarning<TwilightWarningCode>[];
  ambient: {
    sky: SkyCondition;
    model: 'USNO Circular 171';
    uncertaintyStops: number;
    stepMinutes: number;
    points: AmbientPoint[];
  };
}

/**
 * How far (hours) a zone's UTC offset may sit from the place's mean solar time before the answer
 * warns. Real zones run up to about 3 h from it (offsets from the IANA tz database via Intl;
 * places' longitudes from memory): all of China keeps UTC+8 (Kashgar, 76° E, is 2.9 h ahead of
 * the sun), Spain and western Argentina 1.5-2.5 h, Alaska's Bering Sea coast on summer time
 * 3-3.5 h. The margin above that is a judgement (common practice, no source).
 */
export const ZONE_SOLAR_MISMATCH_HOURS = 3.5;

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
    elevation: readElevation(o),
    golden: readBand('goldenHour', o.goldenHour, DEFAULT_GOLDEN),
    blue: readBand('blueHour', o.blueHour, DEFAULT_BLUE),
    stepMinutes: optionalNumber('stepMinutes', o.stepMinutes, 2, { min: 0.5, max: 60 }),
    sky: requireOneOf('sky', o.sky, SKY_CONDITIONS, 'clear'),
    localNoonMs: localToEpoch(cal, 12, timeZone),
  };
}

/**
 * The observer's height in metres, from `elevation` in `elevationUnit`: at most 9000 m, or
 * 29,527 ft (9000 m = 29,527.6 ft, rounded inward so feet never reach past the metre limit).
 */
export const ELEVATION_RANGE: Readonly<Record<LengthUnit, { min: number; max: number }>> = {
  m: { min: 0, max: 9000 },
  ft: { min: 0, max: 29527 },
};

function readElevation(o: Record<string, unknown>): number {
  const unit = requireLengthUnit('elevationUnit', o.elevationUnit);
  return toMetres(optionalNumber('elevation', o.elevation, 0, ELEVATION_RANGE[unit]), unit);
}

const signedHours = (minutes: number): string => {
  const abs = Math.abs(Math.round(minutes));
  const hh = String(Math.floor(abs / 60)).padStart(2, '0');
  return `UTC${minutes < 0 ? '\u2212' : '+'}${hh}:${String(abs % 60).padStart(2, '0')}`;
};

/**
 * Warn when the zone's UTC offset on the date is far from the place's mean solar time,
 * longitude / 15 h: a zone picked for another place (Alps coordinates with a Pacific zone) puts
 * noon in the small hours and sunrise on the previous day. The difference is taken round the
 * clock (±12 h), since a whole day's difference only moves the date: Kiribati's Line Islands keep
 * UTC+14 at 157° W, on the sun's time of day but a day ahead of their neighbours.
 */
export function zoneMismatchWarning(
  p: TwilightParams,
  noonMs: number,
): CodedWarning<'time-zone-mismatch'> | null {
  const zoneMin = offsetMinutes(p.localNoonMs, p.timeZone);
  const solarMin = p.longitude * 4;
  const diff = ((((zoneMin - solarMin + 720) % 1440) + 1440) % 1440) - 720;
  if (Math.abs(diff) <= ZONE_SOLAR_MISMATCH_HOURS * 60) return null;
  const lon = `${round(Math.abs(p.longitude), 2)}\u00b0 ${p.longitude < 0 ? 'W' : 'E'}`;
  return {
    code: 'time-zone-mismatch',
    message:
      `${p.timeZone} is ${signedHours(zoneMin)} on ${p.date}, ${round(Math.abs(diff) / 60, 1)} h ` +
      `${diff > 0 ? 'ahead of' : 'behind'} the sun's time at longitude ${lon} (about ` +
      `${signedHours(solarMin)}): on that clock solar noon comes at ` +
      `${clockOf(toLocalIso(noonMs, p.timeZone))} and events may fall on another day. ` +
      `Check that the time zone is the place's.`,
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
    warnings: [zoneMismatchWarning(p, noonMs)].filter((w) => w !== null),
    ambient: {
      sky: p.sky,
      model: 'USNO Circular 171',
      uncertaintyStops: MODEL_UNCERTAINTY_STOPS[p.sky],
      stepMinutes: p.stepMinutes,
      points: timeline.points,
    },
  };
}
