/**
 * APEX relations (ASA PH2.5-1960; D. A. Kerr, "APEX - The Additive System of Photographic
 * Exposure", 2007): Ev = Av + Tv = Bv + Sv, Av = 2 log2 N, Tv = -log2 t, Sv = log2(S / 3.125).
 */

/** Aperture value Av = 2 log2 N (N = f-number, > 0). */
export const apertureValue = (fNumber: number): number => 2 * Math.log2(fNumber);

/** Time value Tv = -log2 t (t = shutter time, seconds, > 0). */
export const timeValue = (seconds: number): number => -Math.log2(seconds);

/** Speed value Sv = log2(S / 3.125); ISO 100 gives 5. */
export const speedValue = (iso: number): number => Math.log2(iso / 3.125);

/** Exposure value of a setting: EV = log2(N^2 / t) (at whatever ISO is in use). */
export function evFromSettings(fNumber: number, seconds: number): number {
  return Math.log2((fNumber * fNumber) / seconds);
}

/** EV100 equivalent of settings at ISO `iso`: EV - log2(S / 100). */
export function ev100FromSettings(fNumber: number, seconds: number, iso: number): number {
  return evFromSettings(fNumber, seconds) - Math.log2(iso / 100);
}

/** Settings EV needed at ISO `iso` for a scene of `ev100`: EV100 + log2(S / 100). */
export const evAtIso = (ev100: number, iso: number): number => ev100 + Math.log2(iso / 100);

/** Shutter time (s) for a scene EV100 at f-number N and ISO S: t = N^2 / 2^EV. */
export const shutterFor = (ev100: number, fNumber: number, iso: number): number =>
  (fNumber * fNumber) / 2 ** evAtIso(ev100, iso);

/** f-number for a scene EV100 at shutter t and ISO S: N = sqrt(t 2^EV). */
export const apertureFor = (ev100: number, seconds: number, iso: number): number =>
  Math.sqrt(seconds * 2 ** evAtIso(ev100, iso));

/** ISO for a scene EV100 at f-number N and shutter t: S = 100 2^(EV(N,t) - EV100). */
export const isoFor = (ev100: number, fNumber: number, seconds: number): number =>
  100 * 2 ** (evFromSettings(fNumber, seconds) - ev100);
