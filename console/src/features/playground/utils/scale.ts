/** Chart scales and axis ticks for the playground's SVG charts (presentation only). */

export interface LinearScale {
  (value: number): number;
  domain: readonly [number, number];
  range: readonly [number, number];
  invert(pixel: number): number;
}

export function linearScale(
  domain: readonly [number, number],
  range: readonly [number, number],
): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0 || 1;
  const scale = ((value: number) => r0 + ((value - d0) / span) * (r1 - r0)) as LinearScale;
  Object.assign(scale, {
    domain,
    range,
    invert: (pixel: number) => d0 + ((pixel - r0) / (r1 - r0 || 1)) * span,
  });
  return scale;
}

/**
 * "Nice" tick values covering [min, max]: steps of 1, 2 or 5 times a power of ten, after
 * P. S. Heckbert, "Nice Numbers for Graph Labels", Graphics Gems (1990).
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (min === max) return [min];
  const lo = Math.min(min, max);
  const hi = Math.max(min, max);
  const rough = (hi - lo) / Math.max(1, count - 1);
  const power = 10 ** Math.floor(Math.log10(rough));
  const fraction = rough / power;
  const step = (fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10) * power;
  const first = Math.ceil(lo / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let tick = first; tick <= hi + step * 1e-9; tick += step) {
    ticks.push(Number(tick.toPrecision(12)));
  }
  return ticks;
}

/** Nice ticks plus a domain widened outward to whole steps, so the data never leaves the axis. */
export function niceExtent(
  min: number,
  max: number,
  count = 5,
): { domain: [number, number]; ticks: number[] } {
  const inner = niceTicks(min, max, count);
  if (inner.length < 2) return { domain: [min - 1, max + 1], ticks: inner };
  const step = (inner[1] ?? 0) - (inner[0] ?? 0);
  const lo = Math.floor(Math.min(min, max) / step + 1e-9) * step;
  const hi = Math.ceil(Math.max(min, max) / step - 1e-9) * step;
  return { domain: [lo, hi], ticks: niceTicks(lo, hi, Math.round((hi - lo) / step) + 1) };
}

/** An SVG path through points, skipping non-finite values (gaps). */
export function linePath(points: readonly (readonly [number, number])[]): string {
  let path = '';
  let pen = false;
  for (const [x, y] of points) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      pen = false;
      continue;
    }
    path += `${pen ? 'L' : 'M'}${x.toFixed(1)},${y.toFixed(1)}`;
    pen = true;
  }
  return path;
}
