import { countOf, DEG, round } from '../units/math.js';
import { fromMetres, requireLengthUnit, toMetres, type LengthUnit } from '../units/length.js';
import { maybeNumber, optionalNumber, requireNumber, requireObject } from '../units/validate.js';
import { LIGHT_DISTANCE_RANGE } from './key-light.js';
import type { CodedWarning, BacklightWarningCode } from '../warning-codes.js';

/** Beam angle assumed for a bare flash head, degrees. Common practice, no source. */
export const BARE_BEAM_DEG = 100;

export interface BacklightInput {
  /** Height of the light above the ground, 0..10 m (in `distanceUnit`). */
  lightHeight: number;
  /** Horizontal distance of the light behind the subject: 0.1..50 m or 0.33..164 ft. */
  distanceBehind: number;
  /** Height of the subject's head (the rim target); default 1.6 m. */
  headHeight?: number;
  distanceUnit?: 'm' | 'ft';
  /** Beam axis elevation, degrees (+ up, - down), -90..90; default: aimed at the head. */
  tiltDeg?: number;
  /** Full beam angle of the grid or reflector, 1..180 degrees; default bare (100°). */
  beamAngleDeg?: number;
}

export interface BacklightResult {
  distanceUnit: LengthUnit;
  /** Beam axis elevation used, degrees. */
  aimDeg: number;
  /** Direction from the light to the head, degrees of elevation. */
  headDirectionDeg: number;
  headInBeam: boolean;
  distanceToHead: number;
  beamAngleDeg: number;
  /** Where the beam reaches the ground, measured from the subject toward the light; null if it doesn't. */
  groundSpill: { from: number; to: number | null } | null;
  /** Peak ground illuminance relative to the rim on the head, stops (+ = ground brighter). */
  groundVsRimStops: number | null;
  warnings: CodedWarning<BacklightWarningCode>[];
}

/**
 * Geometry of a rim light behind the subject in the vertical plane through light and subject.
 * Illuminance: head E = I / d^2 (rim struck about normally); ground E = I cos(i) / r^2 with
 * cos(i) = H / r, i.e. proportional to sin^3(depression) / H^2, greatest along the steepest ray
 * in the beam. A grid is modelled as a hard-edged cone (no light outside the beam); ground
 * reflectance is not included.
 */
export function computeBacklight(input: BacklightInput): BacklightResult {
  const o = requireObject('input', input);
  const unit = requireLengthUnit('distanceUnit', o.distanceUnit);
  const maxH = unit === 'ft' ? 33 : 10;
  const h = toMetres(requireNumber('lightHeight', o.lightHeight, { min: 0, max: maxH }), unit);
  const behind = toMetres(
    requireNumber('distanceBehind', o.distanceBehind, LIGHT_DISTANCE_RANGE[unit]),
    unit,
  );
  const head = toMetres(
    optionalNumber('headHeight', o.headHeight, fromMetres(1.6, unit), {
      min: unit === 'ft' ? 0.33 : 0.1, // 0.1 m = 0.328 ft, as for the light distances
      max: maxH,
    }),
    unit,
  );
  const beam = optionalNumber('beamAngleDeg', o.beamAngleDeg, BARE_BEAM_DEG, { min: 1, max: 180 });
  const headDir = Math.atan2(head - h, behind) / DEG;
  const aim = maybeNumber('tiltDeg', o.tiltDeg, { min: -90, max: 90 }) ?? headDir;
  const dHead = Math.hypot(behind, head - h);
  const lower = aim - beam / 2;
  const upper = aim + beam / 2;
  const warnings: BacklightResult['warnings'] = [];
  const headInBeam = headDir >= lower - 1e-9 && headDir <= upper + 1e-9;
  if (!headInBeam) {
    warnings.push({
      code: 'head-outside-beam',
      message: 'The head is outside the beam: re-aim the light.',
    });
  }
  let groundSpill: BacklightResult['groundSpill'] = null;
  let groundVsRim: number | null = null;
  if (lower < 0 && h > 0) {
    const steepest = Math.max(lower, -90) * DEG;
    const along = (angle: number): number => behind - h / Math.tan(-angle);
    groundSpill = {
      from: round(fromMetres(along(steepest), unit), 2),
      to: upper < 0 ? round(fromMetres(along(upper * DEG), unit), 2) : null,
    };
    const ratio = (Math.sin(-steepest) ** 3 * dHead * dHead) / (h * h);
    groundVsRim = round(Math.log2(ratio), 2);
    if (groundVsRim > 0) {
      warnings.push({
        code: 'ground-outshines-rim',
        message: `The ground in the beam gets ${countOf(groundVsRim, 'stop')} more light than the rim on the head and will pull the eye from the face: aim higher, add a grid, or raise the light.`,
      });
    }
  }
  if (aim < 0) {
    warnings.push({
      code: 'aimed-down',
      message:
        'Aimed down: a rim light usually works better aimed up at the head from below head height (common practice, no source).',
    });
  }
  return {
    distanceUnit: unit,
    aimDeg: round(aim, 2),
    headDirectionDeg: round(headDir, 2),
    headInBeam,
    distanceToHead: round(fromMetres(dHead, unit), 3),
    beamAngleDeg: beam,
    groundSpill,
    groundVsRimStops: groundVsRim,
    warnings,
  };
}
