import { getPosition } from 'suncalc';
import { DEG } from '../units/math.js';

/**
 * suncalc's refraction term (Meeus 16.4, as used inside suncalc 2.x), radians in and out.
 * suncalc clamps negative altitudes to 0, so below the horizon it adds a constant ~0.48°.
 */
function suncalcRefraction(h: number): number {
  const hh = h < 0 ? 0 : h;
  return 0.0002967 / Math.tan(hh + 0.00312536 / (hh + 0.08901179));
}

const REFRACTION_AT_HORIZON = suncalcRefraction(0);

/**
 * Geometric (airless) altitude of the sun's centre in degrees, -90..90, recovered from
 * suncalc's apparent altitude by inverting its refraction term. Twilight thresholds (-6, -12,
 * -18°) and the USNO illuminance model are defined on geometric altitude.
 */
export function geometricAltitudeDeg(epochMs: number, latitude: number, longitude: number): number {
  const apparent = getPosition(new Date(epochMs), latitude, longitude).altitude * DEG;
  if (apparent < REFRACTION_AT_HORIZON) return (apparent - REFRACTION_AT_HORIZON) / DEG;
  // h + R(h) is increasing with slope >= 0.7, so the fixed-point iteration converges fast.
  let h = apparent - REFRACTION_AT_HORIZON;
  for (let i = 0; i < 8; i++) h = apparent - suncalcRefraction(h);
  return h / DEG;
}

/** Sun azimuth in degrees clockwise from north (0 = N, 90 = E, 180 = S, 270 = W). */
export function sunAzimuthDeg(epochMs: number, latitude: number, longitude: number): number {
  return getPosition(new Date(epochMs), latitude, longitude).azimuth;
}

/**
 * Time (epoch ms) the sun's geometric altitude crosses `thresholdDeg` between `fromMs` and
 * `toMs`, assuming altitude is monotonic on that span (noon to midnight or midnight to noon).
 * Returns null when both ends lie on the same side. Illinois false position, stopping within
 * 1e-5° (well under 0.1 s of sun motion) or a 100 ms bracket.
 */
export function findCrossing(
  thresholdDeg: number,
  fromMs: number,
  toMs: number,
  latitude: number,
  longitude: number,
): number | null {
  const f = (t: number): number => geometricAltitudeDeg(t, latitude, longitude) - thresholdDeg;
  let a = fromMs;
  let b = toMs;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (Math.sign(fa) === Math.sign(fb)) return null;
  let side = 0;
  for (let i = 0; i < 60 && b - a > 100; i++) {
    const c = (a * fb - b * fa) / (fb - fa);
    const fc = f(c);
    if (Math.abs(fc) < 1e-5) return c;
    if (Math.sign(fc) === Math.sign(fb)) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
  }
  return (a + b) / 2;
}
