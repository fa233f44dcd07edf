/**
 * Mireds (micro reciprocal degrees): M = 1e6 / K. A filter's shift is
 * mired(target) - mired(source); positive warms (photographic filter handbooks).
 */

/** Mired value of a colour temperature in kelvin (> 0). */
export const mired = (kelvin: number): number => 1e6 / kelvin;

/** Kelvin from a mired value (> 0). */
export const kelvinFromMired = (m: number): number => 1e6 / m;

/** Shift that turns light of `fromKelvin` into `toKelvin`, mireds (+ = warmer). */
export const miredShift = (fromKelvin: number, toKelvin: number): number =>
  mired(toKelvin) - mired(fromKelvin);

/** Colour temperature after a gel of `shift` mireds: K_out = 1e6 / (1e6 / K + shift). */
export const applyMiredShift = (kelvin: number, shift: number): number =>
  1e6 / (1e6 / kelvin + shift);
