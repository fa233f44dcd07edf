import { ticks as d3Ticks } from 'd3-array';

/** The smallest 1, 2 or 5 × 10ⁿ at or above `value` (at least 1), for a readable y-axis top. */
export function niceCeiling(value: number): number {
  if (!Number.isFinite(value) || value <= 1) return 1;
  const power = 10 ** Math.floor(Math.log10(value));
  for (const step of [1, 2, 5, 10]) {
    if (step * power >= value) return step * power;
  }
  return 10 * power;
}

/**
 * Round tick values from 0 to `top` (d3-array's 1-2-5 steps), whole numbers only: at most `count`
 * intervals, fewer when the top is small (calls are counted, never halved).
 */
export function ticks(top: number, count = 4): number[] {
  if (!Number.isFinite(top) || top <= 0) return [0];
  return d3Ticks(0, top, Math.max(1, Math.min(count, Math.floor(top))));
}
