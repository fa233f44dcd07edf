import { DEG, round } from '../units/math.js';
import { fromMetres, requireLengthUnit, toMetres, type LengthUnit } from '../units/length.js';
import { optionalNumber, requireNumber, requireObject } from '../units/validate.js';

export interface KeyLightInput {
  /** Horizontal angle of the key from the camera axis, 0..180 degrees (either side). */
  angleFromCameraDeg: number;
  /** Light-to-subject distance in `distanceUnit`: 0.1..50 m or 0.33..164 ft. */
  distance: number;
  distanceUnit?: 'm' | 'ft';
  /** Modifier diameter or diagonal, 0.01..10, same unit; a bare head is about 0.08 m. */
  modifierSize: number;
  /** Elevation of the key above the subject's eye line, -30..80 degrees; default 30. */
  elevationDeg?: number;
  /** How far the key is above the ambient fill on the subject, stops, -6..10; default 1. */
  keyOverAmbientStops?: number;
}

/**
 * How near and how far a light may be from the subject, per unit: 10 cm to 50 m, and in feet the
 * same span rounded inward (0.1 m = 0.328 ft, 50 m = 164.04 ft), so a value in feet is never
 * outside the metre range. Shared by the key light and the rim (backlight) distance.
 */
export const LIGHT_DISTANCE_RANGE: Readonly<Record<LengthUnit, { min: number; max: number }>> = {
  m: { min: 0.1, max: 50 },
  ft: { min: 0.33, max: 164 },
};

/**
 * A modifier's size per unit: 1 cm to 10 m, and in feet 0.033 to 33 ft (0.033 ft = 1.006 cm,
 * 33 ft = 10.06 m: the upper end keeps the round figure).
 */
export const MODIFIER_SIZE_RANGE: Readonly<Record<LengthUnit, { min: number; max: number }>> = {
  m: { min: 0.01, max: 10 },
  ft: { min: 0.033, max: 33 },
};

export type SourceQuality = 'hard' | 'medium' | 'soft';
export type ShadowSide = 'frontal' | 'modelled' | 'dramatic' | 'side' | 'behind';

export interface KeyLightResult {
  distanceUnit: LengthUnit;
  /** Light position relative to the subject: toward camera, to the side, above the eyes. */
  position: { towardCamera: number; sideways: number; aboveEyes: number };
  apparentSizeDeg: number;
  sizeToDistance: number;
  quality: SourceQuality;
  shadowSide: ShadowSide;
  /** (key + fill) : fill, e.g. 3 for "3:1". */
  lightingRatio: number;
  lightingRatioLabel: string;
  /** Difference between lit and shadow side, stops. */
  shadowDepthStops: number;
}

/** Size-to-distance thresholds for quality. Common practice, no source. */
const SOFT_AT = 1;
const HARD_BELOW = 0.4;

function shadowSide(angle: number): ShadowSide {
  // Bands are common practice, no source; 45-90° is the trade's "dramatic shadow side".
  if (angle < 15) return 'frontal';
  if (angle < 45) return 'modelled';
  if (angle <= 90) return 'dramatic';
  if (angle <= 110) return 'side';
  return 'behind';
}

/**
 * Key-light placement and character. Apparent size = 2 atan(size / 2d). Lighting ratio, as
 * usually defined in lighting texts (from memory): lit side gets key + fill, shadow side fill
 * only, so ratio = 2^k + 1 for a key k stops over the ambient fill.
 */
export function computeKeyLight(input: KeyLightInput): KeyLightResult {
  const o = requireObject('input', input);
  const unit = requireLengthUnit('distanceUnit', o.distanceUnit);
  const angle = requireNumber('angleFromCameraDeg', o.angleFromCameraDeg, { min: 0, max: 180 });
  // Limits follow the unit, as the backlight's do: 0.1-50 m (0.33-164 ft) away, a modifier of
  // 1 cm-10 m (0.033-33 ft).
  const d = toMetres(requireNumber('distance', o.distance, LIGHT_DISTANCE_RANGE[unit]), unit);
  const size = toMetres(
    requireNumber('modifierSize', o.modifierSize, MODIFIER_SIZE_RANGE[unit]),
    unit,
  );
  const elev = optionalNumber('elevationDeg', o.elevationDeg, 30, { min: -30, max: 80 });
  const k = optionalNumber('keyOverAmbientStops', o.keyOverAmbientStops, 1, { min: -6, max: 10 });
  const ratio = size / d;
  const horizontal = d * Math.cos(elev * DEG);
  const lighting = 2 ** k + 1;
  return {
    distanceUnit: unit,
    position: {
      towardCamera: round(fromMetres(horizontal * Math.cos(angle * DEG), unit), 3),
      sideways: round(fromMetres(horizontal * Math.sin(angle * DEG), unit), 3),
      aboveEyes: round(fromMetres(d * Math.sin(elev * DEG), unit), 3),
    },
    apparentSizeDeg: round((2 * Math.atan(size / (2 * d))) / DEG, 2),
    sizeToDistance: round(ratio, 3),
    quality: ratio >= SOFT_AT ? 'soft' : ratio < HARD_BELOW ? 'hard' : 'medium',
    shadowSide: shadowSide(angle),
    lightingRatio: round(lighting, 2),
    lightingRatioLabel: `${round(lighting, 1)}:1`,
    shadowDepthStops: round(Math.log2(lighting), 2),
  };
}
