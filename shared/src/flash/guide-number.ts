import { MIN_SCALE_FRACTION, decimalScale, fractionLabel, stopsBelowFull } from './power-scale.js';
import { apertureLabel } from '../exposure/scales.js';
import { countOf, round } from '../units/math.js';
import { fromMetres, requireLengthUnit, toMetres, type LengthUnit } from '../units/length.js';
import { optionalNumber, requireNumber, requireObject } from '../units/validate.js';
import type { CodedWarning, FlashWarningCode } from '../warning-codes.js';

/**
 * Guide number (ISO 1230): GN = distance x f-number for correct exposure at ISO 100, full
 * power. GN scales with sqrt(ISO/100) and sqrt(power fraction); a loss of L stops divides it by
 * 2^(L/2).
 */

export interface FlashInput {
  /** Guide number at ISO 100, full power, in `guideNumberUnit`; 1..500. */
  guideNumber: number;
  guideNumberUnit?: LengthUnit;
  /** Light-to-subject distance, > 0, in `distanceUnit` (0.05..1000). */
  distance: number;
  distanceUnit?: LengthUnit;
  /** f-number, 0.7..128. */
  aperture: number;
  /** ISO, 3..409600; default 100. */
  iso?: number;
  /** Light lost in the modifier, stops, 0..8. */
  modifierLossStops?: number;
  /** Light lost in gels, stops, 0..8. */
  gelLossStops?: number;
  /** Lowest power the light can go to, as a fraction; default 1/256. */
  minPowerFraction?: number;
  /**
   * Exposure this light should give on its own, stops relative to a correct exposure at
   * `aperture` and `iso`, -6..6; default 0. -1 when the ambient already supplies half the
   * exposure; +1 for a rim one stop brighter than the key.
   */
  exposureStops?: number;
}

export interface FlashResult {
  /** Fraction of full power needed (may exceed 1 when infeasible). */
  powerFraction: number;
  /** Label on the 1/1..1/256 third-stop scale, e.g. "1/8 +0.3". */
  powerLabel: string;
  /** Value on a decimal 10-stop scale (10 = full). */
  decimalPower: number;
  /** Stops below full power (negative = more than full is needed). */
  stopsBelowFull: number;
  feasible: boolean;
  /** The unit of the guide numbers below (as given). */
  guideNumberUnit: LengthUnit;
  /** The unit of the distances in `fixes` (as given). */
  distanceUnit: LengthUnit;
  /** GN the shot needs at full power (ISO 100, no losses), in the guide-number unit. */
  requiredGuideNumber: number;
  /** Effective GN after ISO and losses, in the guide-number unit. */
  effectiveGuideNumber: number;
  totalLossStops: number;
  /** When infeasible: each single change that would fix it. */
  fixes: {
    moveCloserTo?: number;
    raiseIsoTo?: number;
    raiseIsoByStops?: number;
    openUpTo?: number;
    openUpByStops?: number;
    moveBackTo?: number;
    stopDownTo?: number;
    stopDownByStops?: number;
    lowerIsoTo?: number;
    lowerIsoByStops?: number;
    /** Light to take away in front of the flash: an ND gel or more diffusion, stops. */
    addLossStops?: number;
  } | null;
  warnings: CodedWarning<FlashWarningCode>[];
}

interface FlashParams {
  gnM: number;
  gnUnit: LengthUnit;
  dM: number;
  dUnit: LengthUnit;
  aperture: number;
  iso: number;
  loss: number;
  exposure: number;
  minFraction: number;
}

function readFlash(o: Record<string, unknown>, needAperture: boolean): FlashParams {
  const gnUnit = requireLengthUnit('guideNumberUnit', o.guideNumberUnit);
  const dUnit = requireLengthUnit('distanceUnit', o.distanceUnit);
  const gn = requireNumber('guideNumber', o.guideNumber, { min: 1, max: 500 });
  const d = requireNumber('distance', o.distance, { min: 0.05, max: 1000 });
  return {
    gnM: toMetres(gn, gnUnit),
    gnUnit,
    dM: toMetres(d, dUnit),
    dUnit,
    aperture: needAperture ? requireNumber('aperture', o.aperture, { min: 0.7, max: 128 }) : 0,
    iso: optionalNumber('iso', o.iso, 100, { min: 3, max: 409600 }),
    loss:
      optionalNumber('modifierLossStops', o.modifierLossStops, 0, { min: 0, max: 8 }) +
      optionalNumber('gelLossStops', o.gelLossStops, 0, { min: 0, max: 8 }),
    exposure: optionalNumber('exposureStops', o.exposureStops, 0, { min: -6, max: 6 }),
    minFraction: optionalNumber('minPowerFraction', o.minPowerFraction, MIN_SCALE_FRACTION, {
      min: 1 / 4096,
      max: 1,
    }),
  };
}

/**
 * The lowest ISO most cameras can be set to (their extended low setting): a fix that would need
 * less is not offered. Common practice, no source.
 */
export const LOWEST_CAMERA_ISO = 50;

/** Power needed for an aperture at a distance, with ISO and losses. */
export function computeFlash(input: FlashInput): FlashResult {
  const p = readFlash(requireObject('input', input), true);
  const isoGain = Math.sqrt(p.iso / 100);
  const lossFactor = 2 ** (p.loss / 2);
  // The rated GN (ISO 100, no loss) the light needs to give `exposureStops` at this aperture.
  const requiredM = (p.aperture * p.dM * lossFactor * 2 ** (p.exposure / 2)) / isoGain;
  const fraction = (requiredM / p.gnM) ** 2;
  const s = stopsBelowFull(fraction);
  const tooMuch = fraction > 1 + 1e-9;
  const tooLittle = fraction < p.minFraction * (1 - 1e-9);
  const warnings: FlashResult['warnings'] = [];
  let fixes: FlashResult['fixes'] = null;
  // Fixes are rounded toward enough (to the hundredth; ISO to the whole number), so each one
  // taken as given is feasible.
  const up = (x: number) => Math.ceil(x * 100 - 1e-6) / 100;
  const down = (x: number) => Math.floor(x * 100 + 1e-6) / 100;
  if (tooMuch) {
    const excess = -s;
    fixes = {
      moveCloserTo: down(fromMetres(p.dM * 2 ** (-excess / 2), p.dUnit)),
      raiseIsoTo: Math.ceil(p.iso * 2 ** excess - 1e-6),
      raiseIsoByStops: up(excess),
      openUpTo: down(p.aperture * 2 ** (-excess / 2)),
      openUpByStops: up(excess),
    };
    warnings.push({
      code: 'over-full-power',
      message: `Needs ${countOf(round(excess, 1), 'stop')} more than full power.`,
    });
  } else if (tooLittle) {
    const surplus = Math.log2(p.minFraction / fraction);
    fixes = {
      moveBackTo: up(fromMetres(p.dM * 2 ** (surplus / 2), p.dUnit)),
      stopDownTo: up(p.aperture * 2 ** (surplus / 2)),
      stopDownByStops: up(surplus),
      addLossStops: up(surplus),
    };
    // Lowering ISO is offered only while it stays at a setting cameras have.
    const iso = Math.floor(p.iso * 2 ** -surplus + 1e-6);
    if (iso >= LOWEST_CAMERA_ISO) {
      fixes.lowerIsoTo = iso;
      fixes.lowerIsoByStops = up(surplus);
    }
    warnings.push({
      code: 'below-min-power',
      message: `Needs ${countOf(round(surplus, 1), 'stop')} less than the lowest power: move back, stop down, lower ISO or add ND/diffusion.`,
    });
  }
  return {
    powerFraction: Number(fraction.toPrecision(6)),
    powerLabel: fractionLabel(fraction),
    decimalPower: decimalScale(fraction),
    stopsBelowFull: round(s, 3),
    feasible: !tooMuch && !tooLittle,
    guideNumberUnit: p.gnUnit,
    distanceUnit: p.dUnit,
    requiredGuideNumber: round(fromMetres(requiredM, p.gnUnit), 2),
    effectiveGuideNumber: round(fromMetres((p.gnM * isoGain) / lossFactor, p.gnUnit), 2),
    totalLossStops: round(p.loss, 3),
    fixes,
    warnings,
  };
}

export interface FlashApertureInput extends Omit<FlashInput, 'aperture'> {
  /** Power fraction in use, 1/4096..1. */
  powerFraction: number;
}

/**
 * The inverse: aperture for a power fraction, N = GN sqrt(p) sqrt(ISO/100) / (d 2^(L/2) 2^(E/2))
 * with E the light's `exposureStops`.
 */
export function computeFlashAperture(input: FlashApertureInput): {
  aperture: number;
  apertureLabel: string;
} {
  const o = requireObject('input', input);
  const p = readFlash(o, false);
  const fraction = requireNumber('powerFraction', o.powerFraction, { min: 1 / 4096, max: 1 });
  const n =
    (p.gnM * Math.sqrt(fraction) * Math.sqrt(p.iso / 100)) /
    (p.dM * 2 ** (p.loss / 2) * 2 ** (p.exposure / 2));
  return { aperture: round(n, 4), apertureLabel: apertureLabel(n) };
}

export interface MeterReadingInput {
  /** f-number the meter read, 0.7..128. */
  aperture: number;
  /** Flash-to-meter distance, 0.05..1000. */
  distance: number;
  distanceUnit?: LengthUnit;
  /** Power fraction during the reading; default 1. */
  powerFraction?: number;
  /** ISO set on the meter; default 100. */
  iso?: number;
}

/** A guide number from one meter reading: GN = N d / (sqrt(ISO/100) sqrt(p)). */
export function guideNumberFromMeter(input: MeterReadingInput): {
  guideNumberM: number;
  guideNumberFt: number;
} {
  const o = requireObject('input', input);
  const n = requireNumber('aperture', o.aperture, { min: 0.7, max: 128 });
  const dUnit = requireLengthUnit('distanceUnit', o.distanceUnit);
  const dM = toMetres(requireNumber('distance', o.distance, { min: 0.05, max: 1000 }), dUnit);
  const fraction = optionalNumber('powerFraction', o.powerFraction, 1, { min: 1 / 4096, max: 1 });
  const iso = optionalNumber('iso', o.iso, 100, { min: 3, max: 409600 });
  const gnM = (n * dM) / (Math.sqrt(iso / 100) * Math.sqrt(fraction));
  return { guideNumberM: round(gnM, 2), guideNumberFt: round(fromMetres(gnM, 'ft'), 2) };
}
