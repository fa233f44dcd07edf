import type { FlashResult } from '../flash/guide-number.js';
import { countOf, round } from '../units/math.js';

/**
 * Letting the background go darker when the flashes are too strong for a minute. A darker bias
 * means less ambient exposure (lower ISO, shorter shutter), so the key must give a larger share
 * of the subject's exposure at a less sensitive setting: it needs more power again.
 */

/** The step the bias is lowered by, stops: a third, as cameras step exposure. */
export const BIAS_STEP_STOPS = 1 / 3;

/** The lowest bias the library takes, stops (as `camera.biasStops`). */
const LOWEST_BIAS = -6;

/** The parts of a planned minute the floor logic reads. */
interface PlannedMinute {
  time: string;
  background: { warnings: readonly unknown[] };
  keyFlash: FlashResult;
  rimFlash: FlashResult | null;
  usable: boolean;
}

/**
 * True when the minute fails only because a flash would need less than its lowest power: the
 * background fits and every infeasible flash is too strong (not too weak).
 */
export function onlyFlashTooStrong(m: PlannedMinute): boolean {
  if (m.usable || m.background.warnings.length > 0) return false;
  const infeasible = [m.keyFlash, m.rimFlash].filter(
    (f): f is FlashResult => f !== null && !f.feasible,
  );
  return infeasible.length > 0 && infeasible.every((f) => f.fixes?.addLossStops !== undefined);
}

/**
 * The darker biases to try, brightest first: 1/3-stop steps below `bias` (to the hundredth)
 * down to `floor`, then the floor itself when it falls between two steps.
 */
export function darkerBiases(bias: number, floor: number): number[] {
  const out: number[] = [];
  for (let k = 1; ; k++) {
    const b = round(bias - k * BIAS_STEP_STOPS, 2);
    if (b < floor) break;
    out.push(b);
  }
  const last = out[out.length - 1] ?? bias;
  if (last - floor > 0.005) out.push(floor);
  return out;
}

/**
 * The minute at the brightest bias down to `floor` that makes it usable, with
 * `biasLoweredByStops` set; the minute as planned at `bias` when none does (or when it is
 * unusable for another reason than a flash that is too strong).
 */
export function lowerBiasFor<M extends PlannedMinute>(
  atBias: M,
  bias: number,
  floor: number | undefined,
  planAt: (bias: number) => M,
): M & { biasLoweredByStops: number } {
  if (floor !== undefined && onlyFlashTooStrong(atBias)) {
    for (const b of darkerBiases(bias, floor)) {
      const m = planAt(b);
      if (m.usable) return { ...m, biasLoweredByStops: round(bias - b, 2) };
    }
  }
  return { ...atBias, biasLoweredByStops: 0 };
}

/**
 * With no minute usable: the smallest lowering of the bias (1/3-stop steps, down to the
 * library's -6) that frees a minute, and the first minute it frees, as a sentence; '' when
 * lowering the bias frees none. With a floor given, only biases below it are tried (those down
 * to it were tried when the minutes were planned) and the sentence says the floor is too
 * shallow. `planAt(i, bias)` plans the i-th minute at a bias.
 */
export function floorHint<M extends PlannedMinute>(
  minutes: readonly M[],
  bias: number,
  floor: number | undefined,
  planAt: (index: number, bias: number) => M,
): string {
  const candidates = minutes.map((m, i) => [m, i] as const).filter(([m]) => onlyFlashTooStrong(m));
  if (candidates.length === 0) return '';
  const below = floor ?? bias;
  for (const b of darkerBiases(bias, LOWEST_BIAS)) {
    if (b > below - 0.005) continue;
    const freed = candidates.find(([, i]) => planAt(i, b).usable);
    if (!freed) continue;
    const lowered = round(bias - b, 2);
    const opening =
      floor === undefined
        ? ' Letting the background go darker'
        : ` The floor given (camera.biasFloorStops ${floor}) is too shallow: a darker background`;
    return (
      `${opening} would free ${freed[0].time.slice(11, 16)}: at a bias ` +
      `of ${b} (${countOf(lowered, 'stop')} darker than ${bias}) the flashes stay within their ` +
      `power range. Give camera.biasFloorStops of ${b} or lower (the darkest background you ` +
      `accept) and the planner lowers the bias where that helps.`
    );
  }
  return '';
}
