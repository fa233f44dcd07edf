import { LightingInputError } from '../errors.js';
import { floorHint, lowerBiasFor } from './bias-floor.js';
import { cautionsFor, type Caution } from './cautions.js';
import { prefixed, readSetup, type DuskSetupInput } from './setup-input.js';
import { usableSpans, type UsableSpan } from './usable-spans.js';
import { solveBalance, type BalanceResult } from '../color/balance.js';
import { duskScene, type SceneSwatch } from '../color/scene.js';
import {
  EV100_RANGE,
  GHOSTING_LIMIT_SECONDS,
  solveBackgroundExposure,
  type BackgroundExposureResult,
} from '../exposure/background.js';
import { computeBacklight, type BacklightResult } from '../flash/backlight.js';
import { computeFalloff } from '../flash/falloff.js';
import { computeFlash, type FlashResult } from '../flash/guide-number.js';
import { computeKeyLight, type KeyLightResult } from '../flash/key-light.js';
import { computeTwilight, type TwilightResult } from '../twilight/compute-twilight.js';
import type { AmbientPoint } from '../twilight/timeline.js';
import { countOf, round } from '../units/math.js';
import type { CodedWarning, SetupWarningCode } from '../warning-codes.js';

export type { DuskSetupInput } from './setup-input.js';
export type { UsableSpan } from './usable-spans.js';
export { describeUsableSpans } from './usable-spans.js';

export interface SuggestedMinute {
  time: string;
  sunAltitudeDeg: number;
  ambientEv100: number;
  /** The background at the bias used for this minute (`background.biasStops`). */
  background: BackgroundExposureResult;
  /**
   * Stops the bias was lowered below `camera.biasStops` to make this minute usable (within
   * `camera.biasFloorStops`); 0 when the minute is planned at the bias given.
   */
  biasLoweredByStops: number;
  keyFlash: FlashResult;
  rimFlash: FlashResult | null;
  /**
   * True when settings stay inside every limit (no background warning, ghosting past 1/15 s
   * included) and the flashes are feasible.
   */
  usable: boolean;
}

export interface DuskSetupPlan {
  twilight: Omit<TwilightResult, 'ambient'> & { ambientUncertaintyStops: number };
  /** The shooting window (blue hour, else sunset to civil dusk) and its usable part. */
  window: {
    start: string | null;
    end: string | null;
    /** First usable minute; the usable minutes up to `usableEnd` may have gaps. */
    usableStart: string | null;
    /** Last usable minute. */
    usableEnd: string | null;
    /**
     * The unbroken runs of usable minutes at the timeline's step, in time order; empty when no
     * minute is usable. Between two runs every minute is unusable.
     */
    usableSpans: UsableSpan[];
  };
  suggestedMinutes: SuggestedMinute[];
  whiteBalance: { cameraKelvin: number; fineTune: BalanceResult['whiteBalanceFineTune'] };
  gels: Pick<
    BalanceResult,
    'gels' | 'gelLossStops' | 'powerCompensationStops' | 'residualMired' | 'resultingFlashKelvin'
  >;
  key: KeyLightResult & { modifier: string; modifierLossStops: number };
  backlight: BacklightResult | null;
  backgroundFalloffStops: number | null;
  look: SceneSwatch[];
  cautions: Caution[];
  warnings: CodedWarning<SetupWarningCode>[];
}

type Setup = ReturnType<typeof readSetup>;

/**
 * The minutes of the shooting window, without those darker than the background solver takes
 * (`tooDark` counts them): with no window at all (polar night or day) the whole timeline is
 * considered, and a polar night's ambient falls far below EV100 −10.
 */
function windowPoints(tw: TwilightResult): {
  start: string | null;
  end: string | null;
  points: AmbientPoint[];
  tooDark: number;
} {
  const start = tw.blueHour.start ?? tw.sunset;
  const end = tw.blueHour.end ?? tw.civilDusk;
  const lo = start ? Date.parse(start) : -Infinity;
  const hi = end ? Date.parse(end) : Infinity;
  const inWindow = tw.ambient.points.filter((p) => {
    const t = Date.parse(p.time);
    return t >= lo && t <= hi;
  });
  const points = inWindow.filter((p) => p.ev100 >= EV100_RANGE.min && p.ev100 <= EV100_RANGE.max);
  return { start, end, points, tooDark: inWindow.length - points.length };
}

/**
 * Least share of the exposure the key gives on its own. When the ambient alone comes within
 * this of a full exposure, the key still adds this much (common practice, no source).
 */
const MIN_KEY_SHARE = 1 / 8;

/**
 * How the lit side's exposure splits between the ambient and the key. Exposures add: with the
 * ambient on the subject at `bias - shortfall` stops (the background's level, assuming the
 * subject stands in the same light), the key gives the rest of a correct exposure.
 */
export function keyShare(biasStops: number, shortfallStops: number) {
  const ambient = 2 ** (biasStops - shortfallStops);
  const key = Math.max(1 - ambient, MIN_KEY_SHARE);
  return {
    ambient,
    key,
    keyExposureStops: Math.log2(key),
    keyOverAmbientStops: Math.log2(key / ambient),
    overStops: Math.log2(key + ambient),
  };
}

type PlannedMinute = Omit<SuggestedMinute, 'biasLoweredByStops'>;

/** A minute at the bias given, or at a darker one down to the floor when that frees it. */
function minuteAt(s: Setup, p: AmbientPoint, gelLoss: number): SuggestedMinute {
  return lowerBiasFor(minuteAtBias(s, p, gelLoss, s.bias), s.bias, s.biasFloor, (b) =>
    minuteAtBias(s, p, gelLoss, b),
  );
}

function minuteAtBias(s: Setup, p: AmbientPoint, gelLoss: number, bias: number): PlannedMinute {
  const { biasFloorStops: _floor, ...cam } = s.cam;
  const background = prefixed('camera', () =>
    solveBackgroundExposure({
      ...cam,
      ev100: p.ev100,
      aperture: s.aperture,
      biasStops: bias,
      flashSyncSeconds: s.sync,
      // A portrait: on a tripod the shutter stops at the ghosting limit and ISO rises after it.
      slowestTripodSeconds: GHOSTING_LIMIT_SECONDS,
    }),
  );
  const share = keyShare(bias, background.shortfallStops);
  const flashArgs = { aperture: background.aperture, iso: background.iso, gelLossStops: gelLoss };
  const keyFlash = prefixed('key', () =>
    computeFlash({
      ...s.key,
      ...flashArgs,
      modifierLossStops: s.modifierLoss,
      exposureStops: share.keyExposureStops,
    } as never),
  );
  if (share.overStops > 0.01) {
    keyFlash.warnings.push({
      code: 'ambient-dominates',
      message: `The ambient alone gives ${Math.round(share.ambient * 100)}% of a correct exposure on the subject; with the key at its least share the lit side comes out ${countOf(round(share.overStops, 1), 'stop')} over. Lower the background bias for the key to shape the light.`,
    });
  }
  const rimFlash = s.rim ? rimPower(s, background, gelLoss) : null;
  // Any background warning rules a minute out, ghosting included: the ambient gives a large share
  // of the subject's exposure, so past 1/15 s a moving person blurs under the flash.
  const usable =
    background.warnings.length === 0 &&
    keyFlash.feasible &&
    (rimFlash === null || rimFlash.feasible);
  return {
    time: p.time,
    sunAltitudeDeg: p.sunAltitudeDeg,
    ambientEv100: p.ev100,
    background,
    keyFlash,
    rimFlash,
    usable,
  };
}

function rimPower(s: Setup, bg: BackgroundExposureResult, gelLoss: number): FlashResult {
  const r = s.rim as Record<string, unknown>;
  const over = s.rimOverKeyStops;
  const geometry = prefixed('rim', () => computeBacklight(r as never));
  return prefixed('rim', () =>
    computeFlash({
      guideNumber: r.guideNumber as number,
      guideNumberUnit: r.guideNumberUnit as 'm' | 'ft' | undefined,
      distance: geometry.distanceToHead,
      distanceUnit: geometry.distanceUnit,
      aperture: bg.aperture,
      iso: bg.iso,
      exposureStops: over, // the rim `over` stops brighter than a correct exposure
      modifierLossStops: (r.modifierLossStops as number | undefined) ?? 0,
      gelLossStops: r.gelled === false ? 0 : gelLoss,
    }),
  );
}

function pickSuggestions(all: SuggestedMinute[], n: number): SuggestedMinute[] {
  const usable = all.filter((m) => m.usable);
  const pool = usable.length > 0 ? usable : all;
  if (pool.length <= n) return pool;
  return Array.from(
    { length: n },
    (_, i) => pool[Math.round((i * (pool.length - 1)) / Math.max(1, n - 1))] as SuggestedMinute,
  );
}

/** Run `fn`, naming a field of the inner call as the setup's input names it. */
function renamed<T>(names: Record<string, string>, fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof LightingInputError && names[e.field] !== undefined)
      throw new LightingInputError(names[e.field] as string, e.reason);
    throw e;
  }
}

/**
 * The whole dusk shot plan: window and best minutes, background exposure at each, white
 * balance and gels, key and rim power and placement, the expected look and the cautions.
 */
export function planDuskSetup(input: DuskSetupInput): DuskSetupPlan {
  const s = readSetup(input);
  const o = s.o;
  const tw = computeTwilight({
    latitude: o.latitude,
    longitude: o.longitude,
    date: o.date,
    timeZone: o.timeZone,
    elevation: o.elevation,
    elevationUnit: o.elevationUnit,
    sky: o.sky,
    stepMinutes: o.stepMinutes,
  } as never);
  const balance = renamed({ cameraTint: 'camera.tint', cameraKelvin: 'camera.kelvin' }, () =>
    solveBalance({
      cameraKelvin: s.kelvin,
      cameraTint: s.cam.tint,
      flashKelvin: o.flashKelvin,
      targetMiredOffset: o.targetMiredOffset,
      gels: o.gels,
      maxGels: o.maxGels,
      miredTolerance: o.miredTolerance,
    } as never),
  );
  const win = windowPoints(tw);
  // With no minute to plan (polar day or night) the camera, key and rim inputs are still checked,
  // on a stand-in minute whose result is dropped: bad input is refused by name whatever the date.
  if (win.points.length === 0) {
    const standIn: AmbientPoint = {
      time: `${String(o.date)}T12:00:00Z`,
      sunAltitudeDeg: 0,
      illuminanceLux: 2.5,
      ev100: 0,
      stopsPer10Min: 0,
    };
    minuteAt(s, standIn, 0);
  }
  const minutes = win.points.map((p) => minuteAt(s, p, balance.gelLossStops));
  const usable = minutes.filter((m) => m.usable);
  const suggested = pickSuggestions(minutes, s.suggestions);
  const first = suggested[0];
  // At the bias the first suggested minute was planned at (lowered when the floor allowed it).
  const keyOverAmbient = keyShare(
    first?.background.biasStops ?? s.bias,
    first?.background.shortfallStops ?? 0,
  ).keyOverAmbientStops;
  const key = prefixed('key', () =>
    computeKeyLight({
      angleFromCameraDeg: (s.key.angleFromCameraDeg as number | undefined) ?? 60,
      distance: s.key.distance as number,
      distanceUnit: s.key.distanceUnit as never,
      modifierSize:
        (s.key.modifierSize as number | undefined) ??
        s.modifierSizeM / (s.key.distanceUnit === 'ft' ? 0.3048 : 1),
      keyOverAmbientStops: Math.min(10, Math.max(-6, keyOverAmbient)),
    }),
  );
  const backlight = s.rim ? prefixed('rim', () => computeBacklight(s.rim as never)) : null;
  const bgFalloff =
    o.backgroundDistance === undefined
      ? null
      : computeFalloff({
          subjectDistance: s.key.distance as number,
          backgroundDistance: o.backgroundDistance as number,
        }).subjectToBackgroundStops;
  const rimKelvin =
    s.rim && s.rim.gelled === false ? balance.flashKelvin : balance.resultingFlashKelvin;
  return {
    twilight: { ...withoutAmbient(tw), ambientUncertaintyStops: tw.ambient.uncertaintyStops },
    window: {
      start: win.start,
      end: win.end,
      usableStart: usable[0]?.time ?? null,
      usableEnd: usable[usable.length - 1]?.time ?? null,
      usableSpans: usableSpans(minutes, tw.ambient.stepMinutes),
    },
    suggestedMinutes: suggested,
    whiteBalance: { cameraKelvin: s.kelvin, fineTune: balance.whiteBalanceFineTune },
    gels: {
      gels: balance.gels,
      gelLossStops: balance.gelLossStops,
      powerCompensationStops: balance.powerCompensationStops,
      residualMired: balance.residualMired,
      resultingFlashKelvin: balance.resultingFlashKelvin,
    },
    key: { ...key, modifier: s.modifier, modifierLossStops: s.modifierLoss },
    backlight,
    backgroundFalloffStops: bgFalloff === null ? null : round(bgFalloff, 2),
    look: duskScene(s.kelvin, balance.resultingFlashKelvin, rimKelvin, balance.flashKelvin),
    cautions: cautionsFor({ ...s.conditions, standsCount: 1 + (s.rim ? 1 : 0) }),
    warnings: [
      ...planWarnings(tw, usable.length, backlight, win.tooDark, minutes, s, () =>
        // How far a darker background would have to go to free a minute (below the floor, when
        // one is given: the biases down to it were tried already). Only run with no usable minute.
        floorHint(minutes, s.bias, s.biasFloor, (i, b) =>
          minuteAtBias(s, win.points[i] as AmbientPoint, balance.gelLossStops, b),
        ),
      ),
      // The first suggested minute where the ambient outweighs the key speaks for the evening.
      ...suggested
        .flatMap((m) =>
          m.keyFlash.warnings.filter(
            (w): w is CodedWarning<'ambient-dominates'> => w.code === 'ambient-dominates',
          ),
        )
        .slice(0, 1),
      ...balance.warnings,
    ],
  };
}

function withoutAmbient(tw: TwilightResult): Omit<TwilightResult, 'ambient'> {
  const { ambient: _ambient, ...rest } = tw;
  return rest;
}

/**
 * When no minute is usable but some minute's background fits, the lights are what stands in the
 * way: say at which minute and the single changes that would free it (the first such minute:
 * the ambient only falls after it, so later ones need the flashes further from what they give).
 */
function lightsInTheWay(minutes: SuggestedMinute[], s: Setup): string {
  const m = minutes.find((x) => x.background.warnings.length === 0);
  if (!m) return '';
  const unit = (s.key.distanceUnit as string | undefined) ?? 'm';
  // Stops in prose to a tenth, rounded up (toward enough).
  const st = (v: number) => countOf(Math.ceil(v * 10 - 1e-6) / 10, 'stop');
  const parts: string[] = [];
  for (const [name, f] of [
    ['key', m.keyFlash],
    ['rim', m.rimFlash],
  ] as const) {
    if (!f || f.feasible || !f.fixes) continue;
    const x = f.fixes;
    if (x.addLossStops !== undefined) {
      parts.push(
        `the ${name} needs ${st(x.addLossStops)} less than its lowest power: ` +
          `${name === 'key' && x.moveBackTo !== undefined ? `move it back to ${x.moveBackTo} ${unit} or ` : ''}` +
          `add ${st(x.addLossStops)} of ND or diffusion`,
      );
    } else if (x.raiseIsoByStops !== undefined) {
      parts.push(
        `the ${name} needs ${st(x.raiseIsoByStops)} more than full power: ` +
          `${name === 'key' && x.moveCloserTo !== undefined ? `move it in to ${x.moveCloserTo} ${unit}, ` : ''}` +
          'take away modifier or gel loss, or use a stronger light',
      );
    }
  }
  if (!parts.length) return '';
  return ` At ${m.time.slice(11, 16)} the background fits, but ${parts.join('; ')}.`;
}

function planWarnings(
  tw: TwilightResult,
  usableCount: number,
  backlight: BacklightResult | null,
  tooDark: number,
  minutes: SuggestedMinute[],
  s: Setup,
  biasHint: () => string,
) {
  // The twilight's own warnings (a zone far from the place's solar time) come first.
  const out: CodedWarning<SetupWarningCode>[] = [...tw.warnings];
  if (!tw.sunset)
    out.push({ code: 'no-sunset', message: `No sunset on this date (${tw.reasons.sunset}).` });
  if (tooDark > 0) {
    out.push({
      code: 'too-dark',
      message: `${tooDark} minute${tooDark === 1 ? ' is' : 's are'} darker than EV100 ${EV100_RANGE.min} (night): left out of the plan.`,
    });
  }
  if (usableCount === 0) {
    out.push({
      code: 'no-usable-minute',
      message:
        'No minute in the window fits every limit: see each minute\u2019s warnings (ISO ceiling, tripod, ghosting past 1/15 s, sync, flash power).' +
        lightsInTheWay(minutes, s) +
        biasHint(),
    });
  }
  for (const w of backlight?.warnings ?? [])
    out.push({ code: `rim-${w.code}` as const, message: w.message });
  out.push({
    code: 'ambient-model',
    message: `Ambient light is modelled (USNO Circular 171), \u00b1${countOf(tw.ambient.uncertaintyStops, 'stop')} or more: meter on the night.`,
  });
  return out;
}
