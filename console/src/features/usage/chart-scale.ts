/** The smallest 1, 2 or 5 × 10ⁿ at or above `value` (at least 1), for a readable y-axis top. */
export function niceCeiling(value: number): number {
  if (!Number.isFinite(value) || value <= 1) return 1;
  const power = 10 ** Math.floor(Math.log10(value));
  for (const step of [1, 2, 5, 10]) {
    if (step * power >= value) return step * power;
  }
  return 10 * power;
}

/** Evenly spaced tick values from 0 to `top` inclusive (whole numbers only). */
export function ticks(top: number, count = 4): number[] {
  const step = top / count;
  const values: number[] = [];
  for (let index = 0; index <= count; index++) {
    const value = Math.round(step * index);
    if (!values.includes(value)) values.push(value);
  }
  return values;
}
