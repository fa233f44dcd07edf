import { GEL_CATALOGUE, type Gel } from './gels.js';
import { bestStack, type SearchGel } from './gel-search.js';
import { LightingInputError } from '../errors.js';
import { applyMiredShift, kelvinFromMired, mired } from './mired.js';
import { duskScene, type SceneSwatch } from './scene.js';
import { countOf, round } from '../units/math.js';
import {
  optionalNumber,
  requireArray,
  requireNumber,
  requireObject,
  requireString,
} from '../units/validate.js';
import type { CodedWarning, BalanceWarningCode } from '../warning-codes.js';

/** Camera fine-tune step on the amber-blue axis, mireds. Common practice, from memory (~5). */
export const WB_FINE_TUNE_STEP_MIRED = 5;

/**
 * Amber-blue fine-tune steps a camera usually offers each way. From memory: cameras typically
 * give about ±7 to ±9 steps; the lower end is used so the warning holds for most bodies.
 */
export const WB_FINE_TUNE_USUAL_STEPS = 7;

/**
 * Colour temperatures the balance works in, kelvin: the camera white-balance range it accepts.
 * Gelled light and fine-tuned white balance stay inside it (mireds run out at 0 = infinite K).
 */
export const KELVIN_RANGE = { min: 1500, max: 20000 } as const;
const MIRED_LO = mired(KELVIN_RANGE.max);
const MIRED_HI = mired(KELVIN_RANGE.min);
/** Most gels a stack may hold (the `maxGels` ceiling). */
const MAX_GELS = 4;

export interface BalanceInput {
  /** Camera white balance, kelvin, 1500..20000. */
  cameraKelvin: number;
  /**
   * Camera tint in CC units, -60..60: + means the camera corrects toward magenta for greenish
   * ambient light, so the flash needs plus-green to match. Default 0.
   */
  cameraTint?: number;
  /** Bare flash colour temperature, kelvin, 2500..10000; default 5500 (common practice). */
  flashKelvin?: number;
  /**
   * Extra warmth wanted on the subject, mireds, -200..200 (+ = warmer skin); default 0.
   * mired(cameraKelvin) + offset must stay within 1500..20000 K.
   */
  targetMiredOffset?: number;
  /** The kit; default {@link GEL_CATALOGUE}. Each piece usable once per stack. 1..30 pieces. */
  gels?: Array<{ name: string; miredShift: number; greenShift?: number; lossStops: number }>;
  /** Most gels in one stack, 0..4; default 3. */
  maxGels?: number;
  /**
   * Mireds of error you accept to use fewer gels, 0..50; default 0 (closest stack wins). Any stack
   * within this of the required shift is a match, and the match with the fewest gels (then the
   * least light loss) is chosen; the camera's fine-tune absorbs what is left. About 10 suits most
   * skin (common practice, no source).
   */
  miredTolerance?: number;
}

export interface BalanceResult {
  requiredMiredShift: number;
  achievedMiredShift: number;
  /** achieved - required, mireds (+ = flash warmer than intended). */
  residualMired: number;
  requiredGreenShift: number;
  achievedGreenShift: number;
  residualGreen: number;
  gels: Array<{ name: string; miredShift: number; greenShift: number; lossStops: number }>;
  gelLossStops: number;
  /** Raise flash power by this much to make up for the gels. */
  powerCompensationStops: number;
  /** Camera WB change that cancels the residual on the subject (it also shifts the scene). */
  whiteBalanceFineTune: {
    miredShift: number;
    cameraKelvin: number;
    /**
     * Steps on a camera fine-tune axis where + renders warmer (amber) and - cooler (blue), about
     * 5 mired per step: a too-warm flash (residual > 0) is cancelled by negative (blue) steps.
     */
    amberBlueSteps: number;
    /** Camera tint change (cameraTint convention) that cancels the green residual. */
    tintCC: number;
  };
  flashKelvin: number;
  resultingFlashKelvin: number;
  scene: SceneSwatch[];
  /**
   * `fine-tune-limit`: the camera white balance needed to cancel the residual is out of range.
   * `fine-tune-beyond-range`: cancelling it takes more amber-blue steps than cameras usually offer
   * ({@link WB_FINE_TUNE_USUAL_STEPS} each way); the message says what to do instead.
   */
  warnings: CodedWarning<BalanceWarningCode>[];
}

function readKit(value: unknown): Gel[] {
  if (value === undefined || value === null) return [...GEL_CATALOGUE];
  const arr = requireArray('gels', value, 30);
  return arr.map((raw, i) => {
    const f = `gels[${i}]`;
    const o = requireObject(f, raw);
    return {
      name: requireString(`${f}.name`, o.name, 60),
      miredShift: requireNumber(`${f}.miredShift`, o.miredShift, { min: -400, max: 400 }),
      greenShift: optionalNumber(`${f}.greenShift`, o.greenShift, 0, { min: -60, max: 60 }),
      lossStops: requireNumber(`${f}.lossStops`, o.lossStops, { min: 0, max: 6 }),
      source: 'caller',
    };
  });
}

/** Fine-tune past the usual ±{@link WB_FINE_TUNE_USUAL_STEPS} steps: say so, and what to do. */
function fineTuneRangeWarning(
  steps: number,
  residual: number,
  maxGels: number,
  fineTuneKelvin: number,
  clamped: boolean,
): CodedWarning<'fine-tune-beyond-range'> {
  const kind = residual < 0 ? 'warming' : 'cooling';
  const more = `${residual < 0 ? '+' : '\u2212'}${round(Math.abs(residual), 0)}`;
  const gel =
    maxGels === 0
      ? `No gels were allowed (maxGels 0): allow one, a ${kind} gel of about ${more} mireds`
      : `The best stack of at most ${countOf(maxGels, 'gel')} leaves it: add a ${kind} gel of about ` +
        `${more} mireds to the kit${maxGels < MAX_GELS ? ' or allow more gels (maxGels)' : ''}`;
  const camera = clamped
    ? ''
    : `, or set the camera's white balance to about ${Math.round(fineTuneKelvin)} K instead ` +
      `(the background shifts with it)`;
  return {
    code: 'fine-tune-beyond-range',
    message:
      `Cancelling the ${round(residual, 1)} mired residual takes ` +
      `${countOf(Math.abs(steps), 'fine-tune step')} toward ${steps > 0 ? 'amber' : 'blue'} ` +
      `(${steps > 0 ? '+' : '\u2212'}${Math.abs(steps)}); ` +
      `cameras usually offer about \u00b1${WB_FINE_TUNE_USUAL_STEPS} (some \u00b19). ${gel}${camera}.`,
  };
}

/**
 * Gel the flash so the subject renders as intended under the camera's white balance.
 * Required shift = mired(camera) - mired(flash) + targetMiredOffset. Best stack of at most
 * `maxGels` pieces by residual mired error, then green residual, then fewer gels, then less loss;
 * with `miredTolerance`, the fewest gels among the stacks within that many mireds.
 */
export function solveBalance(input: BalanceInput): BalanceResult {
  const o = requireObject('input', input);
  const camera = requireNumber('cameraKelvin', o.cameraKelvin, KELVIN_RANGE);
  const tint = optionalNumber('cameraTint', o.cameraTint, 0, { min: -60, max: 60 });
  const flash = optionalNumber('flashKelvin', o.flashKelvin, 5500, { min: 2500, max: 10000 });
  const offset = optionalNumber('targetMiredOffset', o.targetMiredOffset, 0, {
    min: -200,
    max: 200,
  });
  const kit = readKit(o.gels);
  const maxGels = optionalNumber('maxGels', o.maxGels, 3, { min: 0, max: MAX_GELS, integer: true });
  const tolerance = optionalNumber('miredTolerance', o.miredTolerance, 0, { min: 0, max: 50 });
  // The subject should render like light of mired(camera) + offset: that light must exist.
  const target = mired(camera) + offset;
  if (target < MIRED_LO - 1e-9 || target > MIRED_HI + 1e-9) {
    throw new LightingInputError(
      'targetMiredOffset',
      `with the camera at ${camera} K, an offset of ${offset} mireds asks the flash for light ` +
        `outside ${KELVIN_RANGE.min}..${KELVIN_RANGE.max} K; use an offset between ` +
        `${Math.ceil(MIRED_LO - mired(camera))} and ${Math.floor(MIRED_HI - mired(camera))}`,
    );
  }
  const required = target - mired(flash);
  const search: SearchGel[] = kit.map((gel, index) => ({ index, ...gel }));
  const best = bestStack(search, maxGels, required, tint, tolerance, {
    min: MIRED_LO - mired(flash),
    max: MIRED_HI - mired(flash),
  });
  const chosen = best.indices.map((i) => kit[i] as Gel);
  const achieved = chosen.reduce((s, gel) => s + gel.miredShift, 0);
  const green = chosen.reduce((s, gel) => s + gel.greenShift, 0);
  const residual = achieved - required;
  const warnings: BalanceResult['warnings'] = [];
  const fineTuneMired = mired(camera) + residual;
  const clampedMired = Math.min(MIRED_HI, Math.max(MIRED_LO, fineTuneMired));
  const clamped = Math.abs(clampedMired - fineTuneMired) > 1e-9;
  if (clamped) {
    warnings.push({
      code: 'fine-tune-limit',
      message:
        `Cancelling the ${round(residual, 1)} mired residual would take the camera past ` +
        `${clampedMired === MIRED_LO ? KELVIN_RANGE.max : KELVIN_RANGE.min} K; the subject ` +
        `stays ${round(Math.abs(fineTuneMired - clampedMired), 1)} mireds ` +
        `${fineTuneMired > clampedMired ? 'warmer' : 'cooler'} than intended.`,
    });
  }
  const fineTuneKelvin = kelvinFromMired(clampedMired);
  const resultingKelvin = applyMiredShift(flash, achieved);
  const steps = -Math.round(residual / WB_FINE_TUNE_STEP_MIRED) || 0;
  if (Math.abs(steps) > WB_FINE_TUNE_USUAL_STEPS) {
    warnings.push(fineTuneRangeWarning(steps, residual, maxGels, fineTuneKelvin, clamped));
  }
  return {
    requiredMiredShift: round(required, 2),
    achievedMiredShift: round(achieved, 2),
    residualMired: round(residual, 2),
    requiredGreenShift: tint,
    achievedGreenShift: round(green, 2),
    residualGreen: round(green - tint, 2),
    gels: chosen.map(({ name, miredShift, greenShift, lossStops }) => ({
      name,
      miredShift,
      greenShift,
      lossStops,
    })),
    gelLossStops: round(best.loss, 2),
    powerCompensationStops: round(best.loss, 2),
    whiteBalanceFineTune: {
      miredShift: round(residual, 2),
      cameraKelvin: Math.round(fineTuneKelvin),
      amberBlueSteps: steps,
      tintCC: round(green - tint, 2),
    },
    flashKelvin: flash,
    resultingFlashKelvin: Math.round(resultingKelvin),
    scene: duskScene(camera, resultingKelvin, resultingKelvin, flash),
    warnings,
  };
}
