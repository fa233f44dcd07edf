/** A candidate gel as the search sees it (already validated). */
export interface SearchGel {
  index: number;
  miredShift: number;
  greenShift: number;
  lossStops: number;
}

export interface StackScore {
  indices: number[];
  miredResidual: number;
  greenResidual: number;
  loss: number;
}

const EPS = 1e-9;

/**
 * Order of stacks, < 0 when `a` is better. A stack whose |mired residual| is within `tolerance`
 * counts as a match: matches beat non-matches and are ranked by |green residual|, then fewer
 * gels, then less light loss, then |mired residual|. Non-matches are ranked by |mired residual|,
 * then |green residual|, then fewer gels, then less loss. With tolerance 0 this is the plain
 * lexicographic order (mired, green, count, loss).
 */
export function compareStacks(a: StackScore, b: StackScore, tolerance = 0): number {
  return compareScores(
    a.miredResidual,
    a.greenResidual,
    a.indices.length,
    a.loss,
    b.miredResidual,
    b.greenResidual,
    b.indices.length,
    b.loss,
    tolerance,
  );
}

function compareScores(
  am: number,
  ag: number,
  an: number,
  al: number,
  bm: number,
  bg: number,
  bn: number,
  bl: number,
  tolerance: number,
): number {
  const amAbs = Math.abs(am);
  const bmAbs = Math.abs(bm);
  const aIn = amAbs <= tolerance + EPS;
  const bIn = bmAbs <= tolerance + EPS;
  if (aIn !== bIn) return aIn ? -1 : 1;
  let d: number;
  if (!aIn) {
    d = amAbs - bmAbs;
    if (Math.abs(d) > EPS) return d;
  }
  d = Math.abs(ag) - Math.abs(bg);
  if (Math.abs(d) > EPS) return d;
  if (an !== bn) return an - bn;
  d = al - bl;
  if (Math.abs(d) > EPS) return d;
  if (aIn) {
    d = amAbs - bmAbs;
    if (Math.abs(d) > EPS) return d;
  }
  return 0;
}

/** Allowed range of a stack's total mired shift (inclusive). */
export interface MiredLimits {
  min: number;
  max: number;
}

/**
 * Best stack of at most `maxGels` distinct pieces, by depth-first enumeration of combinations
 * (each piece used at most once). Mired shifts add; so do green shifts and losses. A stack never
 * mixes warming with cooling pieces, nor plus-green with minus-green: opposing pieces cancel
 * each other and only cost light (common practice, no source). With `limits`, stacks whose total
 * mired shift falls outside them are not candidates. Candidates are scored without allocating;
 * only a new best is copied.
 */
export function bestStack(
  gels: readonly SearchGel[],
  maxGels: number,
  requiredMired: number,
  requiredGreen: number,
  tolerance = 0,
  limits: MiredLimits = { min: -Infinity, max: Infinity },
): StackScore {
  let best: StackScore = {
    indices: [],
    miredResidual: -requiredMired,
    greenResidual: -requiredGreen,
    loss: 0,
  };
  const chosen: number[] = [];
  const visit = (
    start: number,
    mired: number,
    green: number,
    loss: number,
    miredSign: number,
    greenSign: number,
  ): void => {
    if (chosen.length >= maxGels) return;
    for (let i = start; i < gels.length; i++) {
      const gel = gels[i] as SearchGel;
      const ms = Math.sign(gel.miredShift);
      const gs = Math.sign(gel.greenShift);
      if (ms * miredSign < 0 || gs * greenSign < 0) continue;
      const m = mired + gel.miredShift;
      // Pieces of one sign only push further out, so nothing past a limit can come back.
      if (m < limits.min - EPS || m > limits.max + EPS) continue;
      chosen.push(gel.index);
      const gr = green + gel.greenShift;
      const l = loss + gel.lossStops;
      const better =
        compareScores(
          m - requiredMired,
          gr - requiredGreen,
          chosen.length,
          l,
          best.miredResidual,
          best.greenResidual,
          best.indices.length,
          best.loss,
          tolerance,
        ) < 0;
      if (better) {
        best = {
          indices: [...chosen],
          miredResidual: m - requiredMired,
          greenResidual: gr - requiredGreen,
          loss: l,
        };
      }
      visit(i + 1, m, gr, l, miredSign || ms, greenSign || gs);
      chosen.pop();
    }
  };
  visit(0, 0, 0, 0, 0, 0);
  return best;
}
