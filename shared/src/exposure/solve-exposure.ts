import { evAtIso, evFromSettings, apertureFor, isoFor, shutterFor } from './apex.js';
import {
  APERTURE_SCALE,
  ISO_SCALE,
  SHUTTER_SCALE,
  apertureLabel,
  nearestStop,
  shutterLabel,
} from './scales.js';
import { countOf, round } from '../units/math.js';
import { maybeNumber, requireNumber, requireObject } from '../units/validate.js';
import type { CodedWarning, ExposureWarningCode } from '../warning-codes.js';

/** A warning attached to an exposure result: a listed code plus a sentence for people. */
export type Warning = CodedWarning<ExposureWarningCode>;

export interface ExposureInput {
  /** Scene (or incident) EV at ISO 100, -10..25. */
  ev100: number;
  /** f-number, 0.7..128. */
  aperture?: number;
  /** Shutter time, seconds, 1/64000..3600. */
  shutterSeconds?: number;
  /** ISO speed, 3..409600. */
  iso?: number;
}

export interface ExposureResult {
  ev100: number;
  /** Settings EV at the chosen ISO, log2(N^2/t) of the exact solution. */
  ev: number;
  shutterSeconds: number;
  shutterLabel: string;
  aperture: number;
  apertureLabel: string;
  iso: number;
  isoLabel: string;
  /** Which of the three was solved for. */
  solvedFor: 'shutterSeconds' | 'aperture' | 'iso' | 'none';
  /** Nearest third-stop settings and the exposure error they leave, stops (+ = brighter). */
  nominal: { shutterSeconds: number; aperture: number; iso: number; errorStops: number };
  warnings: Warning[];
}

const EV_RANGE = { min: -10, max: 25 };
const N_RANGE = { min: 0.7, max: 128 };
const T_RANGE = { min: 1 / 64000, max: 3600 };
const ISO_RANGE = { min: 3, max: 409600 };

/**
 * Solve the missing one of aperture / shutter / ISO for a scene EV100 (APEX). With all three
 * given, reports how far they are from the metered exposure. With fewer than two, ISO 100 and
 * then f/8 are assumed, in that order.
 */
export function solveExposure(input: ExposureInput): ExposureResult {
  const o = requireObject('input', input);
  const ev100 = requireNumber('ev100', o.ev100, EV_RANGE);
  let n = maybeNumber('aperture', o.aperture, N_RANGE);
  let t = maybeNumber('shutterSeconds', o.shutterSeconds, T_RANGE);
  let s = maybeNumber('iso', o.iso, ISO_RANGE);
  const given = [n, t, s].filter((v) => v !== undefined).length;
  if (given < 2 && s === undefined) s = 100;
  if (given < 2 && n === undefined && t === undefined) n = 8;
  let solvedFor: ExposureResult['solvedFor'] = 'none';
  if (t === undefined) {
    t = shutterFor(ev100, n as number, s as number);
    solvedFor = 'shutterSeconds';
  } else if (n === undefined) {
    n = apertureFor(ev100, t, s as number);
    solvedFor = 'aperture';
  } else if (s === undefined) {
    s = isoFor(ev100, n, t);
    solvedFor = 'iso';
  }
  return describeSettings(ev100, n as number, t, s as number, solvedFor);
}

/** Result object for settings (exact), with nominal snapping and range warnings. */
export function describeSettings(
  ev100: number,
  n: number,
  t: number,
  s: number,
  solvedFor: ExposureResult['solvedFor'],
): ExposureResult {
  const nn = nearestStop(APERTURE_SCALE, n);
  const nt = nearestStop(SHUTTER_SCALE, t);
  const ns = nearestStop(ISO_SCALE, s);
  const exactEv = evFromSettings(n, t);
  const nominalEv = evFromSettings(nn.value, nt.value) - Math.log2(ns.value / 100);
  const warnings: Warning[] = [];
  const offBy = evAtIso(ev100, s) - exactEv; // + = settings give more exposure than metered
  if (Math.abs(offBy) > 0.05) {
    warnings.push({
      code: offBy > 0 ? 'overexposed' : 'underexposed',
      message: `These settings are ${countOf(round(Math.abs(offBy), 1), 'stop')} ${offBy > 0 ? 'over' : 'under'} the metered exposure.`,
    });
  }
  if (t > 30) {
    warnings.push({ code: 'bulb', message: 'Longer than 30 s: use bulb mode and a remote.' });
  }
  if (t < 1 / 8000) {
    warnings.push({ code: 'shutter-too-fast', message: 'Faster than 1/8000 s: use an ND filter.' });
  }
  if (n < 1 || n > 64) {
    warnings.push({ code: 'aperture-off-scale', message: 'Aperture outside f/1 to f/64.' });
  }
  if (s < 50 || s > 102400) {
    warnings.push({ code: 'iso-off-scale', message: 'ISO outside 50 to 102400.' });
  }
  return {
    ev100: round(ev100, 3),
    ev: round(exactEv, 3),
    shutterSeconds: Number(t.toPrecision(6)),
    shutterLabel: shutterLabel(t),
    aperture: round(n, 3),
    apertureLabel: apertureLabel(n),
    iso: round(s, 1),
    isoLabel: ns.label,
    solvedFor,
    nominal: {
      shutterSeconds: Number(nt.value.toPrecision(6)),
      aperture: round(nn.value, 3),
      iso: round(ns.value, 1),
      errorStops: round(evAtIso(ev100, 100) - nominalEv, 2),
    },
    warnings,
  };
}
