// Finds a neutral patch (grey card, white wall) without the caller's help: the most even,
// well-exposed, unclipped block whose colour lies close to the Planckian locus, i.e. a neutral
// surface seen under a roughly black-body light. A heuristic (common practice, no source): the
// caller's rectangle always wins when given.
import { cctFromXy } from '@lumenwright/shared';
import { measurePatch, type Pixels, type Rect } from './patch.js';

const MAX_CV = 0.06;
const MAX_DUV = 0.02;
const MIN_Y = 0.02;
const MAX_Y = 0.92;

export interface AutoPatch {
  rect: Rect;
  score: number;
}

/** Searches `px` (a small working copy) on a half-overlapping grid of square blocks. */
export function findNeutralPatch(px: Pixels): AutoPatch | null {
  const block = Math.max(8, Math.round(Math.min(px.width, px.height) / 12));
  const stride = Math.max(4, Math.round(block / 2));
  let best: AutoPatch | null = null;
  for (let y = 0; y + block <= px.height; y += stride) {
    for (let x = 0; x + block <= px.width; x += stride) {
      const rect = { x, y, width: block, height: block };
      const s = measurePatch(px, rect);
      if (s.clippedFraction > 0 || s.luminance < MIN_Y || s.luminance > MAX_Y) continue;
      if (s.luminanceCv > MAX_CV || !s.xy) continue;
      const c = cctFromXy(s.xy.x, s.xy.y);
      if (c.cct === null || c.duv === null || Math.abs(c.duv) > MAX_DUV) continue;
      // Evenness and closeness to the locus count equally; brighter wins a tie (less noise).
      const score = s.luminanceCv / MAX_CV + Math.abs(c.duv) / MAX_DUV - s.luminance * 0.01;
      if (!best || score < best.score) best = { rect, score };
    }
  }
  return best;
}

/** Maps a rectangle from the working copy back to the full image, trimming 10 % per side. */
export function scaleRect(r: Rect, fx: number, fy: number, width: number, height: number): Rect {
  const x0 = (r.x + r.width * 0.1) * fx;
  const y0 = (r.y + r.height * 0.1) * fy;
  const x1 = (r.x + r.width * 0.9) * fx;
  const y1 = (r.y + r.height * 0.9) * fy;
  const x = Math.max(0, Math.min(width - 1, Math.round(x0)));
  const y = Math.max(0, Math.min(height - 1, Math.round(y0)));
  return {
    x,
    y,
    width: Math.max(1, Math.min(width - x, Math.round(x1 - x0))),
    height: Math.max(1, Math.min(height - y, Math.round(y1 - y0))),
  };
}
