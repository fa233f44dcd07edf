import { apertureFor, isoFor, shutterFor } from './apex.js';
import { describeSettings, type ExposureResult, type Warning } from './solve-exposure.js';
import { shutterLabel } from './scales.js';
import { ambientAt, type AmbientAtInput } from '../twilight/ambient-at.js';
import { LightingInputError } from '../errors.js';
import { countOf, round } from '../units/math.js';
import { maybeNumber, optionalNumber, requireObject, requireOneOf } from '../units/validate.js';

/** Extra flash loss when switching to high-speed sync, stops. Common practice, no source. */
export const HSS_ENTRY_LOSS_STOPS = 1;
/** The scene EV100 range the solver takes (about a moonless night to direct sun on snow). */
export const EV100_RANGE = { min: -10, max: 25 } as const;
/** Default slowest hand-held shutter, s. Common practice, no source (lens- and hand-dependent). */
export const DEFAULT_SLOWEST_HANDHELD = 1 / 60;

export interface BackgroundExposureInput {
  /** Incident ambient EV100, -10..25. Either this or `place`. */
  ev100?: number;
  /** Place and instant to estimate ambient light from (USNO Circular 171). */
  place?: AmbientAtInput;
  /** Stops brighter (+) or darker (-) than metered: taste, not a rule. -6..6, default 0. */
  biasStops?: number;
  /** Fixed f-number (0.7..128). Default f/5.6 unless `iso` is fixed instead. */
  aperture?: number;
  /** Fixed ISO (3..409600); when given without aperture, aperture is solved. */
  iso?: number;
  /** Lowest / highest ISO the solver may use; default 100 / 6400. */
  isoMin?: number;
  isoMax?: number;
  /** Aperture limits when aperture is solved; default f/1.4 .. f/22. */
  apertureMin?: number;
  apertureMax?: number;
  /** Camera support; default handheld. */
  support?: 'handheld' | 'tripod';
  /** Slowest acceptable shutter hand-held, s; default 1/60. */
  slowestHandheldSeconds?: number;
  /** Slowest shutter on a tripod before bulb, s; default 30. */
  slowestTripodSeconds?: number;
  /** Flash sync speed, s (e.g. 1/200). Omit when no flash is used. */
  flashSyncSeconds?: number;
}

export interface BackgroundExposureResult extends ExposureResult {
  biasStops: number;
  /** EV100 the settings expose for (ev100 - biasStops). */
  targetEv100: number;
  ambientSource: 'ev100' | 'place';
  needsTripod: boolean;
  exceedsSync: boolean;
  /** Flash power lost if high-speed sync is used instead, stops; null when within sync. */
  hssLossStops: number | null;
  /** ND filter strength that would bring the shutter back to sync speed, stops. */
  ndStopsForSync: number | null;
  /** Exposure the limits could not reach, stops (+ = darker than wanted). */
  shortfallStops: number;
}

function readInput(input: BackgroundExposureInput) {
  const o = requireObject('input', input);
  let ev100 = maybeNumber('ev100', o.ev100, EV100_RANGE);
  if (ev100 !== undefined && o.place !== undefined && o.place !== null)
    throw new LightingInputError('place', 'give ev100 or place, not both');
  if (o.shutterSeconds !== undefined && o.shutterSeconds !== null)
    throw new LightingInputError(
      'shutterSeconds',
      'is what the background solver finds; leave it out',
    );
  let source: 'ev100' | 'place' = 'ev100';
  if (ev100 === undefined) {
    if (o.place === undefined) throw new LightingInputError('ev100', 'give ev100 or place');
    try {
      ev100 = ambientAt(o.place as AmbientAtInput).ev100;
    } catch (e) {
      if (e instanceof LightingInputError)
        throw new LightingInputError(`place.${e.field}`, e.reason);
      throw e;
    }
    source = 'place';
  }
  const isoMin = optionalNumber('isoMin', o.isoMin, 100, { min: 3, max: 409600 });
  // Defaults of an upper bound follow a lower bound set above them.
  const isoMax = optionalNumber('isoMax', o.isoMax, Math.max(6400, isoMin), {
    min: isoMin,
    max: 409600,
  });
  const apertureMin = optionalNumber('apertureMin', o.apertureMin, 1.4, { min: 0.7, max: 128 });
  return {
    ev100,
    source,
    bias: optionalNumber('biasStops', o.biasStops, 0, { min: -6, max: 6 }),
    aperture: maybeNumber('aperture', o.aperture, { min: 0.7, max: 128 }),
    iso: maybeNumber('iso', o.iso, { min: 3, max: 409600 }),
    isoMin,
    isoMax,
    apertureMin,
    apertureMax: optionalNumber('apertureMax', o.apertureMax, Math.max(22, apertureMin), {
      min: apertureMin,
      max: 128,
    }),
    support: requireOneOf('support', o.support, ['handheld', 'tripod'] as const, 'handheld'),
    handheld: optionalNumber(
      'slowestHandheldSeconds',
      o.slowestHandheldSeconds,
      DEFAULT_SLOWEST_HANDHELD,
      { min: 1 / 8000, max: 30 },
    ),
    tripod: optionalNumber('slowestTripodSeconds', o.slowestTripodSeconds, 30, {
      min: 1 / 8000,
      max: 3600,
    }),
    sync: maybeNumber('flashSyncSeconds', o.flashSyncSeconds, { min: 1 / 16000, max: 1 }),
  };
}

/** Longest ambient exposure before a person ghosts under the flash, s (common practice, no source). */
export const GHOSTING_LIMIT_SECONDS = 1 / 15;

/**
 * Background (ambient) exposure under constraints. Aperture fixed (default f/5.6): ISO rises
 * from isoMin only as far as needed to keep the shutter at or above the slowest allowed time,
 * then the shutter lengthens (needs a tripod) up to the tripod limit. ISO fixed: the shutter
 * starts at sync speed (or 1/125) and the aperture is solved within its limits.
 */
export function solveBackgroundExposure(input: BackgroundExposureInput): BackgroundExposureResult {
  const p = readInput(input);
  const target = (p.ev100 as number) - p.bias;
  const slowest = p.support === 'handheld' ? p.handheld : p.tripod;
  const isoFixed = p.iso !== undefined;
  let iso = p.iso ?? p.isoMin;
  let n = p.aperture ?? (isoFixed ? undefined : 5.6);
  let t: number;
  if (n === undefined) {
    t = p.sync ?? 1 / 125;
    n = apertureFor(target, t, iso);
    if (n > p.apertureMax || n < p.apertureMin) {
      n = Math.min(p.apertureMax, Math.max(p.apertureMin, n));
      t = shutterFor(target, n, iso);
    }
  } else {
    t = shutterFor(target, n, iso);
    if (t > slowest && !isoFixed) {
      iso = Math.min(p.isoMax, Math.max(p.isoMin, isoFor(target, n, slowest)));
      t = shutterFor(target, n, iso);
    }
  }
  const longest = Math.max(p.tripod, slowest);
  const shortfall = t > longest ? Math.log2(t / longest) : 0;
  t = Math.min(t, longest);
  const needsTripod = t > p.handheld * (1 + 1e-9);
  const exceedsSync = p.sync !== undefined && t < p.sync * (1 - 1e-9);
  const base = describeSettings(target, n, t, iso, 'shutterSeconds');
  const warnings: Warning[] = base.warnings.filter((w) => w.code !== 'underexposed');
  if (shortfall > 0.05) {
    warnings.push({
      code: 'too-dark',
      message: `Even at the limits the background stays ${countOf(round(shortfall, 1), 'stop')} darker than wanted.`,
    });
  }
  if (needsTripod && p.support === 'handheld') {
    warnings.push({
      code: 'needs-tripod',
      message: `${shutterLabel(t)} is slower than the hand-held limit ${shutterLabel(p.handheld)}: use a tripod or accept more ISO.`,
    });
  }
  if (t > GHOSTING_LIMIT_SECONDS) {
    warnings.push({
      code: 'subject-motion',
      message:
        'Ambient exposure this long may ghost a moving subject; flash freezes only the flash-lit part. Common practice, no source.',
    });
  }
  const hssLoss = exceedsSync ? HSS_ENTRY_LOSS_STOPS + Math.log2((p.sync as number) / t) : null;
  if (exceedsSync) {
    warnings.push({
      code: 'exceeds-sync',
      message: `${shutterLabel(t)} is faster than sync ${shutterLabel(p.sync as number)}: stop down, add ND, or use high-speed sync and lose about ${countOf(round(hssLoss as number, 1), 'stop')} of flash.`,
    });
  }
  return {
    ...base,
    ev100: round(p.ev100 as number, 3),
    solvedFor: 'shutterSeconds',
    warnings,
    biasStops: p.bias,
    targetEv100: round(target, 3),
    ambientSource: p.source,
    needsTripod,
    exceedsSync,
    hssLossStops: hssLoss === null ? null : round(hssLoss, 2),
    ndStopsForSync: exceedsSync ? round(Math.log2((p.sync as number) / t), 2) : null,
    shortfallStops: round(shortfall, 2),
  };
}
