/** Degrees to radians. */
export const DEG = Math.PI / 180;

/** Round to `digits` decimal places (for presentation; computations keep full precision). */
export function round(value: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

/** Clamp `value` into [lo, hi]. */
export function clamp(value: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, value));
}
