import { ambientIlluminanceLux, ev100FromLux, type SkyCondition } from './ambient-model.js';
import { geometricAltitudeDeg } from './sun-position.js';
import { offsetMinutes, toLocalIso } from '../units/time-zone.js';
import { round } from '../units/math.js';

/** One sample of the evening's ambient light. */
export interface AmbientPoint {
  /** ISO 8601 local time with offset. */
  time: string;
  /** Geometric altitude of the sun's centre, degrees. */
  sunAltitudeDeg: number;
  /** Modelled horizontal illuminance, lux. */
  illuminanceLux: number;
  /** Incident EV at ISO 100 (log2(E / 2.5)). */
  ev100: number;
  /** Rate of change of EV100, stops per 10 minutes; negative = getting darker. */
  stopsPer10Min: number;
}

/** Samples plus the epoch times they were taken at (the latter for internal callers). */
export interface TimelineSamples {
  points: AmbientPoint[];
  epochs: number[];
}

/** Hard cap so a tiny step over a long polar evening cannot blow up the response. */
export const MAX_TIMELINE_POINTS = 1500;

/**
 * Ambient timeline from `startMs` to `endMs` (inclusive) every `stepMinutes`, with the rate
 * of change from neighbouring samples (central differences, one-sided at the ends).
 */
export function ambientTimeline(
  latitude: number,
  longitude: number,
  startMs: number,
  endMs: number,
  stepMinutes: number,
  sky: SkyCondition,
  timeZone: string,
): TimelineSamples {
  const stepMs = stepMinutes * 60_000;
  const n = Math.min(MAX_TIMELINE_POINTS, Math.floor((endMs - startMs) / stepMs) + 1);
  const epochs: number[] = [];
  const alt: number[] = [];
  const ev: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = startMs + i * stepMs;
    epochs.push(t);
    const h = geometricAltitudeDeg(t, latitude, longitude);
    alt.push(h);
    ev.push(ev100FromLux(ambientIlluminanceLux(h, sky)));
  }
  // One offset lookup when the evening has no DST change (the usual case).
  const o0 = offsetMinutes(startMs, timeZone);
  const sameOffset = n > 0 && o0 === offsetMinutes(epochs[n - 1] ?? startMs, timeZone);
  const points = epochs.map((t, i) => {
    const prev = i > 0 ? i - 1 : i;
    const next = i < n - 1 ? i + 1 : i;
    const span = (next - prev) * stepMinutes;
    const rate = span > 0 ? (((ev[next] ?? 0) - (ev[prev] ?? 0)) / span) * 10 : 0;
    const lux = ambientIlluminanceLux(alt[i] ?? 0, sky);
    return {
      time: toLocalIso(t, timeZone, sameOffset ? o0 : undefined),
      sunAltitudeDeg: round(alt[i] ?? 0, 3),
      illuminanceLux: Number(lux.toPrecision(4)),
      ev100: round(ev[i] ?? 0, 2),
      stopsPer10Min: round(rate, 2),
    };
  });
  return { points, epochs };
}
