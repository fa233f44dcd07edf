// Statistics of a rectangle of 8-bit sRGB pixels, averaged in linear light (never in code values).
import { linearRgbToXyz, srgbToLinear, xyzToXy } from './colour.js';

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Pixels {
  data: Buffer;
  width: number;
  height: number;
  channels: number;
}

export interface PatchStats {
  pixels: number;
  /** Mean linear RGB, 0..1. */
  linear: { r: number; g: number; b: number };
  /** Mean relative luminance Y (linear, white = 1). */
  luminance: number;
  /** Coefficient of variation of per-pixel luminance: 0 = perfectly even. */
  luminanceCv: number;
  /** Share of pixels with any channel at code value >= 250 (clipped or nearly). */
  clippedFraction: number;
  xy: { x: number; y: number } | null;
}

const LINEAR = Float64Array.from({ length: 256 }, (_, i) => srgbToLinear(i / 255));
const CLIP_CODE = 250;

export function measurePatch(px: Pixels, rect: Rect): PatchStats {
  let r = 0;
  let g = 0;
  let b = 0;
  let ySum = 0;
  let ySq = 0;
  let clipped = 0;
  const n = rect.width * rect.height;
  for (let row = rect.y; row < rect.y + rect.height; row++) {
    let i = (row * px.width + rect.x) * px.channels;
    for (let col = 0; col < rect.width; col++, i += px.channels) {
      const cr = px.data[i]!;
      const cg = px.data[i + 1]!;
      const cb = px.data[i + 2]!;
      const lr = LINEAR[cr]!;
      const lg = LINEAR[cg]!;
      const lb = LINEAR[cb]!;
      r += lr;
      g += lg;
      b += lb;
      const y = 0.2126 * lr + 0.7152 * lg + 0.0722 * lb;
      ySum += y;
      ySq += y * y;
      if (cr >= CLIP_CODE || cg >= CLIP_CODE || cb >= CLIP_CODE) clipped++;
    }
  }
  const mean = { r: r / n, g: g / n, b: b / n };
  const yMean = ySum / n;
  const variance = Math.max(0, ySq / n - yMean * yMean);
  return {
    pixels: n,
    linear: mean,
    luminance: yMean,
    luminanceCv: yMean > 0 ? Math.sqrt(variance) / yMean : Infinity,
    clippedFraction: clipped / n,
    xy: xyzToXy(linearRgbToXyz(mean.r, mean.g, mean.b)),
  };
}
