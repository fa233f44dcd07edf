import {
  MODEL_UNCERTAINTY_STOPS,
  SKY_CONDITIONS,
  ambientIlluminanceLux,
  ev100FromLux,
  type SkyCondition,
} from './ambient-model.js';
import { geometricAltitudeDeg } from './sun-position.js';
import { round } from '../units/math.js';
import { requireInstant } from '../units/time-zone.js';
import { requireNumber, requireObject, requireOneOf } from '../units/validate.js';

export interface AmbientAtInput {
  /** Degrees, -90..90. */
  latitude: number;
  /** Degrees, -180..180. */
  longitude: number;
  /** ISO 8601 instant with offset or Z, e.g. `2026-06-21T21:30:00+01:00`. */
  time: string;
  sky?: SkyCondition;
}

export interface AmbientAtResult {
  sunAltitudeDeg: number;
  illuminanceLux: number;
  ev100: number;
  sky: SkyCondition;
  model: 'USNO Circular 171';
  uncertaintyStops: number;
}

/** Incident ambient light at one place and instant (USNO Circular 171 model). */
export function ambientAt(input: AmbientAtInput): AmbientAtResult {
  const o = requireObject('input', input);
  const latitude = requireNumber('latitude', o.latitude, { min: -90, max: 90 });
  const longitude = requireNumber('longitude', o.longitude, { min: -180, max: 180 });
  const t = requireInstant('time', o.time);
  const sky = requireOneOf('sky', o.sky, SKY_CONDITIONS, 'clear');
  const h = geometricAltitudeDeg(t, latitude, longitude);
  const lux = ambientIlluminanceLux(h, sky);
  return {
    sunAltitudeDeg: round(h, 3),
    illuminanceLux: Number(lux.toPrecision(4)),
    ev100: round(ev100FromLux(lux), 2),
    sky,
    model: 'USNO Circular 171',
    uncertaintyStops: MODEL_UNCERTAINTY_STOPS[sky],
  };
}
