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
 * Lexicographic order of stacks: smaller |mired residual|, then |green residual|, then fewer
 * gels, then less light loss. Returns < 0 when `a` is better.
 */
export function compareStacks(a: StackScore, b: StackScore): number {
  const keys: Array<[number, number]> = [
    [Math.abs(a.miredResidual), Math.abs(b.miredResidual)],
    [Math.abs(a.greenResidual), Math.abs(b.greenResidual)],
    [a.indices.length, b.indices.length],
    [a.loss, b.loss],
  ];
  for (const [x, y] of keys) if (Math.abs(x - y) > EPS) return x - y;
  return 0;
}

/**
 * Best stack of at most `maxGels` distinct pieces, by depth-first enumeration of combinations
 * (each piece used at most once). Mired shifts add; so do green shifts and losses.
 */
export function bestStack(
  gels: readonly SearchGel[],
  maxGels: number,
  requiredMired: number,
  requiredGreen: number,
): StackScore {
  let best: StackScore = {
    indices: [],
    miredResidual: -requiredMired,
    greenResidual: -requiredGreen,
    loss: 0,
  };
  const chosen: number[] = [];
  const visit = (start: number, mired: number, green: number, loss: number): void => {
    if (chosen.length >= maxGels) return;
    for (let i = start; i < gels.length; i++) {
      const gel = gels[i] as SearchGel;
      chosen.push(gel.index);
      const m = mired + gel.miredShift;
      const gr = green + gel.greenShift;
      const l = loss + gel.lossStops;
      const cand = {
        indices: [...chosen],
        miredResidual: m - requiredMired,
        greenResidual: gr - requiredGreen,
        loss: l,
      };
      if (compareStacks(cand, best) < 0) best = cand;
      visit(i + 1, m, gr, l);
      chosen.pop();
    }
  };
  visit(0, 0, 0, 0);
  return best;
}
