import { LightingInputError } from '../errors.js';
import { round } from '../units/math.js';
import { requireLengthUnit, type LengthUnit } from '../units/length.js';
import { maybeNumber, optionalNumber, requireNumber, requireObject } from '../units/validate.js';

/**
 * Inverse-square falloff for a small source: E = I cos(theta) / d^2 (photometry handbooks), so
 * from distance d1 to d2 the light drops by 2 log2(d2 / d1) stops (positive = darker).
 */
export function stopsBetween(d1: number, d2: number): number {
  return 2 * Math.log2(d2 / d1);
}

export interface FalloffInput {
  /** Light-to-subject distance, 0.05..1000, in `distanceUnit`. */
  subjectDistance: number;
  /** Light-to-background distance (optional mark). */
  backgroundDistance?: number;
  /** Light-to-ground distance of the nearest ground in frame (optional mark). */
  groundDistance?: number;
  distanceUnit?: LengthUnit;
  /** Series range; default subjectDistance / 2 .. 3 x the farthest mark. */
  from?: number;
  to?: number;
  /** Number of series points, 2..500; default 40 (log-spaced). */
  points?: number;
}

export interface FalloffMark {
  id: 'subject' | 'background' | 'ground';
  distance: number;
  /** Stops relative to the subject (negative = darker). */
  stopsRelativeToSubject: number;
}

export interface FalloffResult {
  distanceUnit: LengthUnit;
  marks: FalloffMark[];
  /** Stops the background sits below the subject (positive = darker); null if not given. */
  subjectToBackgroundStops: number | null;
  series: Array<{ distance: number; stopsRelativeToSubject: number; relativeIlluminance: number }>;
}

const D_RANGE = { min: 0.05, max: 1000 };

/** Falloff from the subject to other distances, with a log-spaced series for a chart. */
export function computeFalloff(input: FalloffInput): FalloffResult {
  const o = requireObject('input', input);
  const unit = requireLengthUnit('distanceUnit', o.distanceUnit);
  const subject = requireNumber('subjectDistance', o.subjectDistance, D_RANGE);
  const background = maybeNumber('backgroundDistance', o.backgroundDistance, D_RANGE);
  const ground = maybeNumber('groundDistance', o.groundDistance, D_RANGE);
  const far = Math.max(subject, background ?? 0, ground ?? 0);
  // The series runs from `from` to a farther `to` (equal ends would chart one point 40 times).
  const from = optionalNumber('from', o.from, subject / 2, { min: D_RANGE.min, max: 999 });
  const to = optionalNumber('to', o.to, Math.min(1000, Math.max(far * 3, from * 2)), D_RANGE);
  if (to <= from) throw new LightingInputError('to', `must be beyond from (${from})`);
  const n = optionalNumber('points', o.points, 40, { min: 2, max: 500, integer: true });
  const rel = (d: number): number => round(-stopsBetween(subject, d), 3);
  const marks: FalloffMark[] = [{ id: 'subject', distance: subject, stopsRelativeToSubject: 0 }];
  if (background !== undefined) {
    marks.push({ id: 'background', distance: background, stopsRelativeToSubject: rel(background) });
  }
  if (ground !== undefined) {
    marks.push({ id: 'ground', distance: ground, stopsRelativeToSubject: rel(ground) });
  }
  const series = Array.from({ length: n }, (_, i) => {
    const d = from * (to / from) ** (i / (n - 1));
    return {
      distance: round(d, 4),
      stopsRelativeToSubject: rel(d),
      relativeIlluminance: Number(((subject / d) ** 2).toPrecision(5)),
    };
  });
  return {
    distanceUnit: unit,
    marks,
    subjectToBackgroundStops:
      background === undefined ? null : round(stopsBetween(subject, background), 3),
    series,
  };
}
