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

/** "1 stop", "1.5 stops", "−1 stop", "0 stops": a number with its unit, singular only for ±1. */
export function countOf(n: number, unit: string): string {
  return `${n} ${unit}${Math.abs(n) === 1 ? '' : 's'}`;
}
