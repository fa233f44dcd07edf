/**
 * Flash power labels. Power fraction p of full output; stops below full = -log2 p.
 * Fraction scale 1/1 .. 1/256 in thirds, written as the whole-stop fraction plus +0.3/+0.7
 * (e.g. 2/3 stop above 1/16 is "1/16 +0.7"); decimal scale where 10 = full and each 1.0 is one
 * stop (so 1/8 is 7.0).
 */

/** Lowest fraction on the usual scale (1/256, eight stops below full). */
export const MIN_SCALE_FRACTION = 1 / 256;

/** Stops below full power for a fraction (0 < p). */
export const stopsBelowFull = (fraction: number): number => -Math.log2(fraction);

/** Round a stop count to the nearest third. */
export const toThirds = (stops: number): number => Math.round(stops * 3) / 3;

/**
 * Fraction-scale label for a power fraction, to the nearest third of a stop:
 * "1/1", "1/8 +0.3", "1/16 +0.7". Above full or below 1/256 the label says so.
 */
export function fractionLabel(fraction: number): string {
  const thirds = Math.round(stopsBelowFull(fraction) * 3);
  if (thirds < 0) return `above 1/1 (+${(-thirds / 3).toFixed(1)} stops)`;
  if (thirds > 24) return 'below 1/256';
  const whole = Math.ceil(thirds / 3);
  const extra = whole * 3 - thirds; // 0, 1 or 2 thirds above the whole-stop fraction
  const base = `1/${2 ** whole}`;
  return extra === 0 ? base : `${base} +${extra === 1 ? '0.3' : '0.7'}`;
}

/** Decimal-scale value (10 = full, one unit per stop), to 0.1; may fall outside 0..10. */
export function decimalScale(fraction: number): number {
  return Math.round((10 - stopsBelowFull(fraction)) * 10) / 10;
}
